using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Operations;

/// <summary>
/// <c>append</c> (spec §2.3): rows of the bottom table after the rows of the top one. Columns are matched by
/// name (the top's order, then the bottom's extra columns); a column missing on one side is filled with
/// missing values; int64 and float64 unify to float64; other type pairs follow the typed-write rule: under
/// <c>boxed</c> the column becomes object, under <c>arrow</c> it is <c>E-TYPE</c>. A side whose cells are
/// all missing takes the other side's type. Results are normalised for the mode (§2.1).
/// </summary>
public static class Appending
{
    public static Table Append(Table top, Table bottom, Mode mode)
    {
        var names = new List<string>(top.ColumnCount + bottom.ColumnCount);
        names.AddRange(top.Names);
        foreach (var name in bottom.Names)
            if (top.IndexOf(name) < 0) names.Add(name);
        var columns = new Column[names.Count];
        for (var c = 0; c < names.Count; c++)
        {
            var ti = top.IndexOf(names[c]);
            var bi = bottom.IndexOf(names[c]);
            var t = ti >= 0 ? top.Columns[ti] : AllMissing(bottom.Columns[bi].Type, top.RowCount, mode);
            var b = bi >= 0 ? bottom.Columns[bi] : AllMissing(t.Type, bottom.RowCount, mode);
            columns[c] = ColumnFactory.Normalize(Concat(names[c], t, b, mode), mode);
        }
        return new Table(names, columns, top.RowCount + bottom.RowCount);
    }

    private static Column Concat(string name, Column t, Column b, Mode mode)
    {
        var marker = mode.Missing;
        switch (t, b)
        {
            case (Int64Column x, Int64Column y):
            {
                var data = ConcatPrimitive(x, y, out var v);
                return new Int64Column(data, v, marker);
            }
            case (TimestampColumn x, TimestampColumn y):
            {
                var data = ConcatPrimitive(x, y, out var v);
                return new TimestampColumn(data, v, marker);
            }
            case (BoolColumn x, BoolColumn y):
            {
                var data = ConcatPrimitive(x, y, out var v);
                return new BoolColumn(data, v, marker);
            }
            case (Float64Column x, Float64Column y):
            {
                var data = ConcatPrimitive(x, y, out var v);
                return new Float64Column(data, v, marker);
            }
            case (Int64Column x, Float64Column y):
                return Concat(name, ToFloat(x, mode), y, mode);
            case (Float64Column x, Int64Column y):
                return Concat(name, x, ToFloat(y, mode), mode);
            case (Utf8Column x, Utf8Column y):
            {
                var builder = new Utf8ColumnBuilder(x.Length + y.Length, ByteLength(x) + ByteLength(y));
                AppendUtf8(builder, x);
                AppendUtf8(builder, y);
                return builder.Build(marker);
            }
            case (ObjectColumn x, ObjectColumn y):
            {
                var cells = new object?[x.Length + y.Length];
                x.Cells.Span.CopyTo(cells);
                y.Cells.Span.CopyTo(cells.AsSpan(x.Length));
                return new ObjectColumn(cells, marker);
            }
            default:
                return ConcatValues(name, t, b, mode);
        }
    }

    /// <summary>The general path: decode both sides and apply the typed-write rule.</summary>
    private static Column ConcatValues(string name, Column t, Column b, Mode mode)
    {
        var tk = Kinds(t);
        var bk = Kinds(b);
        var kinds = tk | bk;
        if (tk != 0 && bk != 0 && System.Numerics.BitOperations.PopCount((uint)kinds) > 1 && mode.IsArrow)
        {
            throw new EngineException(ErrorCodes.Type,
                $"append: column '{name}' is {t.TypeLabel} in the first frame and {b.TypeLabel} in the second; under arrow storage a column holds one type");
        }
        var values = new Value[t.Length + b.Length];
        for (var i = 0; i < t.Length; i++) values[i] = t.GetValue(i);
        for (var i = 0; i < b.Length; i++) values[t.Length + i] = b.GetValue(i);
        var hint = tk != 0 ? t.Type : b.Type;
        return ColumnFactory.FromValues(values, mode, hint, ErrorCodes.Type);
    }

    /// <summary>Bit set of the value kinds a column holds (1 numbers, 2 bools, 4 strings, 8 timestamps).</summary>
    private static int Kinds(Column c)
    {
        switch (c.Type)
        {
            case ColumnType.Int64 or ColumnType.Float64: return c.MissingCount == c.Length ? 0 : 1;
            case ColumnType.Bool: return c.MissingCount == c.Length ? 0 : 2;
            case ColumnType.Utf8: return c.MissingCount == c.Length ? 0 : 4;
            case ColumnType.Timestamp: return c.MissingCount == c.Length ? 0 : 8;
        }
        var kinds = 0;
        for (var i = 0; i < c.Length; i++)
        {
            kinds |= c.GetValue(i).Kind switch
            {
                ValueKind.Int64 or ValueKind.Float64 => 1,
                ValueKind.Bool => 2,
                ValueKind.String => 4,
                ValueKind.Timestamp => 8,
                _ => 0,
            };
        }
        return kinds;
    }

    private static T[] ConcatPrimitive<T>(PrimitiveColumn<T> x, PrimitiveColumn<T> y, out Validity validity)
        where T : unmanaged
    {
        var data = new T[x.Length + y.Length];
        x.Span.CopyTo(data);
        y.Span.CopyTo(data.AsSpan(x.Length));
        if (!x.Validity.HasBitmap && !y.Validity.HasBitmap)
        {
            validity = Validity.AllValid(data.Length);
            return data;
        }
        var bits = new byte[(data.Length + 7) >> 3];
        for (var i = 0; i < x.Length; i++)
            if (x.Validity.IsValid(i)) bits[i >> 3] |= (byte)(1 << (i & 7));
        for (var i = 0; i < y.Length; i++)
        {
            var j = x.Length + i;
            if (y.Validity.IsValid(i)) bits[j >> 3] |= (byte)(1 << (j & 7));
        }
        validity = new Validity(bits, 0, data.Length);
        return data;
    }

    private static Float64Column ToFloat(Int64Column column, Mode mode)
    {
        var src = column.Span;
        var data = new double[src.Length];
        var v = column.Validity;
        for (var i = 0; i < data.Length; i++) data[i] = v.IsValid(i) ? src[i] : double.NaN;
        // Under nan the NaN is the marker; under null keep the validity bitmap.
        return mode.IsNan || !v.HasBitmap
            ? new Float64Column(data, mode.Missing)
            : new Float64Column(data, v, mode.Missing);
    }

    private static int ByteLength(Utf8Column c) => c.Length == 0 ? 0 : c.Offsets[c.Length] - c.Offsets[0];

    private static void AppendUtf8(Utf8ColumnBuilder builder, Utf8Column column)
    {
        var offsets = column.Offsets;
        var data = column.Data;
        for (var i = 0; i < column.Length; i++)
        {
            if (column.Array.IsNull(i)) builder.AppendMissing();
            else builder.Append(data[offsets[i]..offsets[i + 1]]);
        }
    }

    /// <summary>A column of <paramref name="type"/> whose every cell is missing.</summary>
    private static Column AllMissing(ColumnType type, int length, Mode mode)
    {
        var marker = mode.Missing;
        var none = new Validity(new byte[(length + 7) >> 3], 0, length);
        switch (type)
        {
            case ColumnType.Int64: return new Int64Column(new long[length], none, marker);
            case ColumnType.Timestamp: return new TimestampColumn(new long[length], none, marker);
            case ColumnType.Bool: return new BoolColumn(new bool[length], none, marker);
            case ColumnType.Float64:
            {
                var data = new double[length];
                data.AsSpan().Fill(double.NaN);
                return mode.IsNan ? new Float64Column(data, marker) : new Float64Column(data, none, marker);
            }
            case ColumnType.Utf8:
            {
                var b = new Utf8ColumnBuilder(length, 0);
                for (var i = 0; i < length; i++) b.AppendMissing();
                return b.Build(marker);
            }
            default:
            {
                var cells = new object?[length];
                if (mode.IsNan) cells.AsSpan().Fill(double.NaN);
                return new ObjectColumn(cells, marker);
            }
        }
    }
}
