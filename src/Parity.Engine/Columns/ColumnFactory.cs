using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Columns;

/// <summary>
/// Builds columns from decoded values under a mode, applying the type rules of spec §2.1: under <c>nan</c>
/// an integer column with a missing cell becomes float64 and a bool column becomes object; strings are
/// boxed or Arrow by storage; mixed values are object under <c>boxed</c> and an error under <c>arrow</c>.
/// Generic and allocation-heavy by design: kernels build typed buffers directly and call <see cref="Normalize"/>.
/// </summary>
public static class ColumnFactory
{
    /// <summary>
    /// Builds a column from values. <paramref name="hint"/> decides the type of an all-missing column.
    /// Throws <see cref="EngineException"/> with <paramref name="mixedCode"/> when strings and non-strings
    /// meet under <c>arrow</c>.
    /// </summary>
    public static Column FromValues(ReadOnlySpan<Value> values, Mode mode, ColumnType? hint = null, string mixedCode = ErrorCodes.Type)
    {
        var type = InferType(values, mode, hint, mixedCode);
        return Build(values, type, mode);
    }

    /// <summary>The column type that holds all of <paramref name="values"/> under <paramref name="mode"/>.</summary>
    public static ColumnType InferType(ReadOnlySpan<Value> values, Mode mode, ColumnType? hint, string mixedCode = ErrorCodes.Type)
    {
        bool anyInt = false, anyFloat = false, anyBool = false, anyString = false, anyTime = false, anyMissing = false;
        foreach (var v in values)
        {
            switch (v.Kind)
            {
                case ValueKind.Int64: anyInt = true; break;
                case ValueKind.Float64: anyFloat = true; break;
                case ValueKind.Bool: anyBool = true; break;
                case ValueKind.String: anyString = true; break;
                case ValueKind.Timestamp: anyTime = true; break;
                default: anyMissing = true; break;
            }
        }
        var kinds = (anyInt || anyFloat ? 1 : 0) + (anyBool ? 1 : 0) + (anyString ? 1 : 0) + (anyTime ? 1 : 0);
        if (kinds == 0)
        {
            var t = hint ?? (mode.IsBoxed ? ColumnType.Object : ColumnType.Float64);
            if (t == ColumnType.Object && mode.IsArrow) t = ColumnType.Utf8;
            if (t == ColumnType.Utf8 && mode.IsBoxed) t = ColumnType.Object;
            return Widen(t, anyMissing, mode);
        }
        if (kinds > 1)
        {
            if (anyString && mode.IsArrow)
                throw new EngineException(mixedCode, "an Arrow string column holds only strings or missing values");
            return ColumnType.Object;
        }
        if (anyString) return mode.IsArrow ? ColumnType.Utf8 : ColumnType.Object;
        if (anyTime) return ColumnType.Timestamp;
        if (anyBool) return Widen(ColumnType.Bool, anyMissing, mode);
        return Widen(anyFloat ? ColumnType.Float64 : ColumnType.Int64, anyMissing, mode);
    }

    /// <summary>The type a column of <paramref name="type"/> takes once it holds a missing cell under <paramref name="mode"/>.</summary>
    public static ColumnType Widen(ColumnType type, bool hasMissing, Mode mode)
    {
        if (!hasMissing || mode.IsNull) return type;
        return type switch
        {
            ColumnType.Int64 => ColumnType.Float64,
            ColumnType.Bool => ColumnType.Object,
            _ => type,
        };
    }

    /// <summary>Builds a column of a known type; values must fit it (ints widen to floats).</summary>
    public static Column Build(ReadOnlySpan<Value> values, ColumnType type, Mode mode)
    {
        var n = values.Length;
        var marker = mode.Missing;
        switch (type)
        {
            case ColumnType.Int64:
            {
                var data = new long[n];
                var valid = new bool[n];
                for (var i = 0; i < n; i++)
                {
                    if (values[i].IsMissing) continue;
                    data[i] = values[i].Kind == ValueKind.Bool ? (values[i].Bool ? 1 : 0) : values[i].Int64;
                    valid[i] = true;
                }
                return new Int64Column(data, Validity.FromFlags(valid), marker);
            }
            case ColumnType.Float64:
            {
                var data = new double[n];
                var valid = new bool[n];
                for (var i = 0; i < n; i++)
                {
                    var v = values[i];
                    if (v.IsMissing)
                    {
                        data[i] = double.NaN;
                        valid[i] = mode.IsNan; // under nan the NaN itself is the marker
                        continue;
                    }
                    data[i] = v.AsDouble;
                    valid[i] = true;
                }
                return new Float64Column(data, Validity.FromFlags(valid), marker);
            }
            case ColumnType.Bool:
            {
                var data = new bool[n];
                var valid = new bool[n];
                for (var i = 0; i < n; i++)
                {
                    if (values[i].IsMissing) continue;
                    data[i] = values[i].Bool;
                    valid[i] = true;
                }
                return new BoolColumn(data, Validity.FromFlags(valid), marker);
            }
            case ColumnType.Timestamp:
            {
                var data = new long[n];
                var valid = new bool[n];
                for (var i = 0; i < n; i++)
                {
                    if (values[i].IsMissing) continue;
                    data[i] = values[i].TimestampMicros;
                    valid[i] = true;
                }
                return new TimestampColumn(data, Validity.FromFlags(valid), marker);
            }
            case ColumnType.Utf8:
            {
                var b = new Utf8ColumnBuilder(n, n * 8);
                foreach (var v in values)
                {
                    if (v.IsMissing) b.AppendMissing();
                    else b.Append(v.Kind == ValueKind.String ? v.String : ValueText.Format(v));
                }
                return b.Build(marker);
            }
            default:
            {
                var cells = new object?[n];
                for (var i = 0; i < n; i++)
                {
                    var v = values[i];
                    // Under null there is one marker: a null reference.
                    cells[i] = v.IsMissing && mode.IsNull ? null : ObjectColumn.ToCell(v);
                }
                return new ObjectColumn(cells, marker);
            }
        }
    }

    /// <summary>Decodes every cell of a column.</summary>
    public static Value[] ToValues(Column column)
    {
        var values = new Value[column.Length];
        for (var i = 0; i < values.Length; i++) values[i] = column.GetValue(i);
        return values;
    }

    /// <summary>
    /// Applies the §2.1 representation rules to a freshly built column: under <c>nan</c> an int64 column with
    /// missing cells becomes float64 (NaN) and a bool column with missing cells becomes object.
    /// </summary>
    public static Column Normalize(Column column, Mode mode)
    {
        if (mode.IsNull) return column;
        switch (column)
        {
            case Int64Column ic when ic.MissingCount > 0:
            {
                var src = ic.Span;
                var data = new double[src.Length];
                for (var i = 0; i < data.Length; i++) data[i] = ic.Validity.IsValid(i) ? src[i] : double.NaN;
                return new Float64Column(data, mode.Missing);
            }
            case Float64Column fc when fc.Validity.HasBitmap:
            {
                var src = fc.Span;
                var data = new double[src.Length];
                for (var i = 0; i < data.Length; i++) data[i] = fc.Validity.IsValid(i) ? src[i] : double.NaN;
                return new Float64Column(data, mode.Missing);
            }
            case BoolColumn bc when bc.MissingCount > 0:
                return Build(ToValues(bc), ColumnType.Object, mode);
            default:
                return column;
        }
    }

    /// <summary>
    /// Replaces rows [offset, offset+part.Length) of <paramref name="full"/> with <paramref name="part"/>,
    /// unifying the types under <paramref name="mode"/> (a boxed write may turn the whole column into object).
    /// </summary>
    public static Column Splice(Column full, int offset, Column part, Mode mode, string mixedCode = ErrorCodes.TypeWrite)
    {
        if (offset == 0 && part.Length == full.Length) return part;
        var values = ToValues(full);
        for (var i = 0; i < part.Length; i++) values[offset + i] = part.GetValue(i);
        var hint = full.Type == part.Type ? full.Type : (ColumnType?)null;
        if (hint is null)
        {
            if (full.Type == ColumnType.Float64 || part.Type == ColumnType.Float64) hint = ColumnType.Float64;
        }
        return FromValues(values, mode, hint, mixedCode);
    }
}
