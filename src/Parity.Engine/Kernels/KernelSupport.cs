using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary>Shared helpers of the kernels: missing flags, numeric views, result builders.</summary>
internal static class KernelSupport
{
    /// <summary>Per-row missing flags (any marker), or null when no row is missing.</summary>
    public static bool[]? MissingFlags(Column c)
    {
        switch (c)
        {
            case Float64Column f when f.Marker == MissingMarker.Nan:
            {
                var span = f.Span;
                bool[]? flags = null;
                for (var i = 0; i < span.Length; i++)
                {
                    if (!double.IsNaN(span[i]) && f.Validity.IsValid(i)) continue;
                    flags ??= new bool[span.Length];
                    flags[i] = true;
                }
                return flags;
            }
            case Utf8Column u:
                return u.MissingCount == 0 ? null : FromValidity(u);
            case ObjectColumn o:
            {
                var cells = o.Cells.Span;
                bool[]? flags = null;
                for (var i = 0; i < cells.Length; i++)
                {
                    if (!ObjectColumn.IsMissingCell(cells[i], o.Marker)) continue;
                    flags ??= new bool[cells.Length];
                    flags[i] = true;
                }
                return flags;
            }
            default:
                if (c.MissingCount == 0) return null;
                var all = new bool[c.Length];
                for (var i = 0; i < all.Length; i++) all[i] = c.IsMissing(i);
                return all;
        }
    }

    private static bool[] FromValidity(Utf8Column u)
    {
        var flags = new bool[u.Length];
        for (var i = 0; i < flags.Length; i++) flags[i] = u.Array.IsNull(i);
        return flags;
    }

    public static bool[]? Or(bool[]? a, bool[]? b)
    {
        if (a is null) return b;
        if (b is null) return a;
        var r = new bool[a.Length];
        for (var i = 0; i < r.Length; i++) r[i] = a[i] | b[i];
        return r;
    }

    /// <summary>True when every cell is missing (a broadcast <c>null</c> literal): such a column fits any type.</summary>
    public static bool AllMissing(Column c) => c.Length > 0 && c.MissingCount == c.Length;

    public static bool IsString(Column c) => c is Utf8Column || (c is ObjectColumn o && o.IsStringsOnly);

    public static bool IsNumeric(Column c) => c is Int64Column || c is Float64Column;

    public static EngineException TypeError(string what, Column c) =>
        new(ErrorCodes.Type, $"{what} does not apply to a {c.TypeLabel} column");

    /// <summary>
    /// A numeric view of a column: int64 and float64 as they are; an object column whose values are all
    /// numbers (or missing) converted; anything else is <c>E-TYPE</c>.
    /// </summary>
    public static Column AsNumeric(Column c, Mode mode, string what)
    {
        if (IsNumeric(c)) return c;
        if (c is ObjectColumn || AllMissing(c))
        {
            var n = c.Length;
            var anyFloat = false;
            for (var i = 0; i < n; i++)
            {
                var v = c.GetValue(i);
                if (v.IsMissing) continue;
                if (v.Kind == ValueKind.Float64) anyFloat = true;
                else if (v.Kind != ValueKind.Int64) throw TypeError(what, c);
            }
            var missing = MissingFlags(c);
            if (anyFloat || (missing is not null && mode.IsNan))
            {
                var d = new double[n];
                var valid = new bool[n];
                for (var i = 0; i < n; i++)
                {
                    var v = c.GetValue(i);
                    d[i] = v.IsMissing ? double.NaN : v.AsDouble;
                    valid[i] = !v.IsMissing || mode.IsNan;
                }
                return new Float64Column(d, Validity.FromFlags(valid), mode.Missing);
            }
            var l = new long[n];
            var lv = new bool[n];
            for (var i = 0; i < n; i++)
            {
                var v = c.GetValue(i);
                if (v.IsMissing) continue;
                l[i] = v.Int64;
                lv[i] = true;
            }
            return new Int64Column(l, Validity.FromFlags(lv), mode.Missing);
        }
        throw TypeError(what, c);
    }

    /// <summary>A double array of a numeric column's values (missing rows hold NaN).</summary>
    public static double[] ToDoubles(Column c)
    {
        var n = c.Length;
        var d = new double[n];
        switch (c)
        {
            case Int64Column ic:
            {
                var s = ic.Span;
                for (var i = 0; i < n; i++) d[i] = s[i];
                if (ic.Validity.HasBitmap)
                    for (var i = 0; i < n; i++) if (!ic.Validity.IsValid(i)) d[i] = double.NaN;
                return d;
            }
            case Float64Column fc:
            {
                fc.Span.CopyTo(d);
                if (fc.Validity.HasBitmap)
                    for (var i = 0; i < n; i++) if (!fc.Validity.IsValid(i)) d[i] = double.NaN;
                return d;
            }
            default:
                throw new ArgumentException("not numeric", nameof(c));
        }
    }

    /// <summary>
    /// A float64 result: under <c>nan</c> missing rows become NaN sentinels; under <c>null</c> they are
    /// cleared in the validity bitmap and a NaN produced by arithmetic stays a value.
    /// </summary>
    public static Float64Column Float(double[] data, bool[]? missing, Mode mode)
    {
        if (missing is null) return new Float64Column(data, mode.Missing);
        if (mode.IsNan)
        {
            for (var i = 0; i < data.Length; i++) if (missing[i]) data[i] = double.NaN;
            return new Float64Column(data, mode.Missing);
        }
        return new Float64Column(data, ValidityOf(missing), mode.Missing);
    }

    /// <summary>An int64 result: under <c>nan</c> a missing row turns it into float64 (spec §2.1).</summary>
    public static Column Int(long[] data, bool[]? missing, Mode mode)
    {
        if (missing is null) return new Int64Column(data, mode.Missing);
        if (mode.IsNull) return new Int64Column(data, ValidityOf(missing), mode.Missing);
        var d = new double[data.Length];
        for (var i = 0; i < d.Length; i++) d[i] = missing[i] ? double.NaN : data[i];
        return new Float64Column(d, mode.Missing);
    }

    /// <summary>A bool result: under <c>nan</c> a missing row turns it into object with NaN (spec §2.1).</summary>
    public static Column Bool(bool[] data, bool[]? missing, Mode mode)
    {
        if (missing is null) return new BoolColumn(data, mode.Missing);
        if (mode.IsNull) return new BoolColumn(data, ValidityOf(missing), mode.Missing);
        var cells = new object?[data.Length];
        object t = true, f = false, nan = double.NaN;
        for (var i = 0; i < cells.Length; i++) cells[i] = missing[i] ? nan : data[i] ? t : f;
        return new ObjectColumn(cells, mode.Missing);
    }

    public static Validity ValidityOf(bool[] missing)
    {
        var bits = new byte[(missing.Length + 7) >> 3];
        var any = false;
        for (var i = 0; i < missing.Length; i++)
        {
            if (missing[i]) { any = true; continue; }
            bits[i >> 3] |= (byte)(1 << (i & 7));
        }
        return any ? new Validity(bits, 0, missing.Length) : Validity.AllValid(missing.Length);
    }

    /// <summary>The cell a missing string result holds under boxed storage: NaN under <c>nan</c>, a null reference under <c>null</c>.</summary>
    public static object? MissingStringCell(Mode mode) => mode.IsNan ? double.NaN : null;

    public static void CheckLength(Column a, Column b)
    {
        if (a.Length != b.Length) throw new ArgumentException("operand lengths differ");
    }
}
