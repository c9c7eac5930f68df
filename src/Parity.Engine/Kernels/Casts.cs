using System.Globalization;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary>
/// <c>cast c to int64|float64|bool|string|timestamp</c> and <c>text(x)</c>. Casting to the type a column
/// already has returns the same column object (no copy). docs/semantics.md, "cast c to int64": to int64 with a
/// missing value is <c>E-CAST</c> under <c>nan</c> (NaN has no integer form) and keeps the null under <c>null</c>;
/// a float with a fractional part is truncated toward zero under <c>nan</c> and is <c>E-CAST</c> under <c>null</c>,
/// whose Arrow-backed integers refuse a lossy cast. To string follows <c>text(x)</c>: under <c>boxed+nan</c> a
/// missing value becomes the string <c>nan</c>, in every other mode it stays missing. Rows in messages are
/// numbered from 0, as everywhere a user reads them.
/// </summary>
public static class Casts
{
    public static Column Cast(Column c, ColumnType target, Mode mode)
    {
        if (target is ColumnType.Utf8 or ColumnType.Object) return Text(c, mode);
        if (c.Type == target) return c;
        return target switch
        {
            ColumnType.Int64 => ToInt64(c, mode),
            ColumnType.Float64 => ToFloat64(c, mode),
            ColumnType.Bool => ToBool(c, mode),
            _ => ToTimestamp(c, mode),
        };
    }

    /// <summary><c>text(x)</c>: floats in shortest round-trip form with a fractional digit, bools true/false, timestamps ISO 8601 Z.</summary>
    public static Column Text(Column c, Mode mode)
    {
        var n = c.Length;
        var nanText = mode.IsBoxed && mode.IsNan;
        if (c is Utf8Column && mode.IsArrow) return c;
        if (c is ObjectColumn o && o.IsStringsOnly && (!nanText || o.MissingCount == 0)) return c;
        if (mode.IsArrow)
        {
            var b = new Utf8ColumnBuilder(n, n * 8);
            Span<byte> buf = stackalloc byte[32];
            for (var i = 0; i < n; i++)
            {
                if (c is Int64Column ic && ic.Validity.IsValid(i) && ic.Span[i].TryFormat(buf, out var w, default, CultureInfo.InvariantCulture))
                {
                    b.Append(buf[..w]);
                    continue;
                }
                var v = c.GetValue(i);
                if (v.IsMissing) b.AppendMissing();
                else b.Append(ValueText.Format(v));
            }
            return b.Build(mode.Missing);
        }
        var cells = new object?[n];
        for (var i = 0; i < n; i++)
        {
            var v = c.GetValue(i);
            if (!v.IsMissing) cells[i] = ValueText.Format(v);
            else if (nanText) cells[i] = "nan";
            else cells[i] = null;
        }
        return new ObjectColumn(cells, mode.Missing);
    }

    private static EngineException Fail(Column c, int row, string target, string why) =>
        new(ErrorCodes.Cast, $"cannot cast {Describe(c.GetValue(row))} (row {row}) to {target}: {why}");

    private static string Describe(Value v) => v.Kind switch
    {
        ValueKind.String => "'" + v.String + "'",
        ValueKind.Missing => ValueText.MissingName(v.Missing),
        _ => ValueText.Format(v),
    };

    private static Column ToInt64(Column c, Mode mode)
    {
        var n = c.Length;
        var data = new long[n];
        var missing = KernelSupport.MissingFlags(c);
        if (missing is not null && mode.IsNan)
            throw Fail(c, Array.IndexOf(missing, true), "int64", "NaN has no integer form");
        for (var i = 0; i < n; i++)
        {
            if (missing is not null && missing[i]) continue;
            var v = c.GetValue(i);
            switch (v.Kind)
            {
                case ValueKind.Int64: data[i] = v.Int64; break;
                case ValueKind.Bool: data[i] = v.Bool ? 1 : 0; break;
                case ValueKind.Timestamp: data[i] = v.TimestampMicros; break;
                case ValueKind.Float64:
                {
                    var d = v.Float64;
                    if (double.IsNaN(d) || double.IsInfinity(d)) throw Fail(c, i, "int64", "not a finite number");
                    var t = Math.Truncate(d); // toward zero, as legacy stacks' integer casts do
                    if (t != d && mode.IsNull) throw Fail(c, i, "int64", "it has a fractional part and the cast would lose it");
                    if (t < -9.2233720368547758e18 || t >= 9.2233720368547758e18) throw Fail(c, i, "int64", "out of range");
                    data[i] = (long)t;
                    break;
                }
                default:
                    if (!long.TryParse(v.String, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out data[i]))
                        throw Fail(c, i, "int64", "not an integer");
                    break;
            }
        }
        return KernelSupport.Int(data, missing, mode);
    }

    private static Column ToFloat64(Column c, Mode mode)
    {
        var n = c.Length;
        if (c is Int64Column) return KernelSupport.Float(KernelSupport.ToDoubles(c), KernelSupport.MissingFlags(c), mode);
        var data = new double[n];
        var missing = KernelSupport.MissingFlags(c);
        for (var i = 0; i < n; i++)
        {
            if (missing is not null && missing[i]) continue;
            var v = c.GetValue(i);
            switch (v.Kind)
            {
                case ValueKind.Int64: data[i] = v.Int64; break;
                case ValueKind.Float64: data[i] = v.Float64; break;
                case ValueKind.Bool: data[i] = v.Bool ? 1 : 0; break;
                case ValueKind.String:
                    if (!double.TryParse(v.String, NumberStyles.Float, CultureInfo.InvariantCulture, out data[i]))
                        throw Fail(c, i, "float64", "not a number");
                    break;
                default:
                    throw Fail(c, i, "float64", "a timestamp has no float form");
            }
        }
        return KernelSupport.Float(data, missing, mode);
    }

    private static Column ToBool(Column c, Mode mode)
    {
        var n = c.Length;
        var data = new bool[n];
        var missing = KernelSupport.MissingFlags(c);
        for (var i = 0; i < n; i++)
        {
            if (missing is not null && missing[i]) continue;
            var v = c.GetValue(i);
            switch (v.Kind)
            {
                case ValueKind.Bool: data[i] = v.Bool; break;
                case ValueKind.Int64: data[i] = v.Int64 != 0; break;
                case ValueKind.Float64:
                    if (double.IsNaN(v.Float64)) throw Fail(c, i, "bool", "NaN has no truth value");
                    data[i] = v.Float64 != 0;
                    break;
                case ValueKind.String:
                    if (string.Equals(v.String, "true", StringComparison.OrdinalIgnoreCase)) data[i] = true;
                    else if (!string.Equals(v.String, "false", StringComparison.OrdinalIgnoreCase)) throw Fail(c, i, "bool", "expected true or false");
                    break;
                default:
                    throw Fail(c, i, "bool", "a timestamp has no truth value");
            }
        }
        return KernelSupport.Bool(data, missing, mode);
    }

    private static Column ToTimestamp(Column c, Mode mode)
    {
        var n = c.Length;
        var data = new long[n];
        var missing = KernelSupport.MissingFlags(c);
        for (var i = 0; i < n; i++)
        {
            if (missing is not null && missing[i]) continue;
            var v = c.GetValue(i);
            switch (v.Kind)
            {
                case ValueKind.Timestamp: data[i] = v.TimestampMicros; break;
                case ValueKind.Int64: data[i] = v.Int64; break; // microseconds since the epoch
                case ValueKind.String:
                    if (!DateTimeOffset.TryParse(v.String, CultureInfo.InvariantCulture,
                            DateTimeStyles.AssumeUniversal | DateTimeStyles.AdjustToUniversal, out var t))
                        throw Fail(c, i, "timestamp", "not an ISO 8601 date-time");
                    data[i] = ValueText.ToMicros(t);
                    break;
                default:
                    throw Fail(c, i, "timestamp", "only strings and integer microseconds convert");
            }
        }
        var validity = missing is null ? Validity.AllValid(n) : KernelSupport.ValidityOf(missing);
        return new TimestampColumn(data, validity, mode.Missing);
    }
}
