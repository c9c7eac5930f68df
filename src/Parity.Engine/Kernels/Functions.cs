using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary><c>coalesce</c>, <c>abs</c>, <c>round</c>, <c>type_of</c> (spec §3.4, §2.2, §2.3).</summary>
public static class Functions
{
    /// <summary>The first non-missing argument per row; the result type unifies the arguments (the typed-write rule).</summary>
    public static Column Coalesce(IReadOnlyList<Column> args, Mode mode)
    {
        if (args.Count == 0) throw new ArgumentException("coalesce needs an argument", nameof(args));
        var n = args[0].Length;
        var first = args[0];
        var flags = KernelSupport.MissingFlags(first);
        if (flags is null) return first;
        var values = new Value[n];
        ColumnType? hint = null;
        foreach (var a in args)
        {
            KernelSupport.CheckLength(first, a);
            if (hint is null && !KernelSupport.AllMissing(a)) hint = a.Type;
        }
        for (var i = 0; i < n; i++)
        {
            var v = first.GetValue(i);
            for (var k = 1; v.IsMissing && k < args.Count; k++) v = args[k].GetValue(i);
            values[i] = v;
        }
        return ColumnFactory.FromValues(values, mode, hint ?? first.Type, ErrorCodes.Type);
    }

    public static Column Abs(Column x, Mode mode)
    {
        var a = KernelSupport.AsNumeric(x, mode, "abs");
        var missing = KernelSupport.MissingFlags(a);
        if (a is Int64Column ia)
        {
            var src = ia.Span;
            var data = new long[src.Length];
            var overflow = -1;
            for (var i = 0; i < src.Length; i++)
            {
                var v = src[i];
                if (v == long.MinValue && overflow < 0 && (missing is null || !missing[i])) overflow = i;
                data[i] = v < 0 ? unchecked(-v) : v;
            }
            if (overflow >= 0) throw new EngineException(ErrorCodes.Overflow, $"int64 overflow in abs at row {overflow}");
            return KernelSupport.Int(data, missing, mode);
        }
        var d = KernelSupport.ToDoubles(a);
        for (var i = 0; i < d.Length; i++) d[i] = Math.Abs(d[i]);
        return KernelSupport.Float(d, missing, mode);
    }

    /// <summary>
    /// <c>round(x, digits)</c>, half to even (IEEE 754 roundTiesToEven). The column keeps its type: int64 with
    /// digits &gt;= 0 is unchanged, with negative digits rounds to a multiple of a power of ten.
    /// </summary>
    public static Column Round(Column x, Column digits, Mode mode)
    {
        var a = KernelSupport.AsNumeric(x, mode, "round");
        var dcol = KernelSupport.AsNumeric(digits, mode, "round digits");
        var missing = KernelSupport.Or(KernelSupport.MissingFlags(a), KernelSupport.MissingFlags(dcol));
        var dg = new long[a.Length];
        if (dcol is Int64Column di) di.Span.CopyTo(dg);
        else if (!KernelSupport.AllMissing(dcol)) throw KernelSupport.TypeError("round digits", dcol);
        if (a is Int64Column ia)
        {
            var src = ia.Span;
            var data = new long[src.Length];
            for (var i = 0; i < src.Length; i++) data[i] = dg[i] >= 0 ? src[i] : RoundInt(src[i], dg[i]);
            return KernelSupport.Int(data, missing, mode);
        }
        var d = KernelSupport.ToDoubles(a);
        for (var i = 0; i < d.Length; i++) d[i] = RoundDouble(d[i], dg[i]);
        return KernelSupport.Float(d, missing, mode);
    }

    private static double RoundDouble(double v, long digits)
    {
        if (double.IsNaN(v) || double.IsInfinity(v)) return v;
        if (digits > 15) return v;
        if (digits >= 0) return Math.Round(v, (int)digits, MidpointRounding.ToEven);
        if (digits < -308) return 0 * v;
        var p = Math.Pow(10, -digits);
        return Math.Round(v / p, MidpointRounding.ToEven) * p;
    }

    private static long RoundInt(long v, long digits)
    {
        if (digits < -18) return 0;
        long p = 1;
        for (var k = 0; k < -digits; k++) p *= 10;
        var q = v / p;
        var r = v % p;
        var twice = Math.Abs(r) * 2; // |r| < p <= 1e18, so this cannot overflow
        if (twice > p || (twice == p && (q & 1) != 0)) q += Math.Sign(r);
        return q * p;
    }

    /// <summary><c>type_of(c)</c>: the column's type label in this mode, as text, on every row.</summary>
    public static Column TypeOf(Column c, Mode mode) => Broadcast.Strings(c.TypeLabel, c.Length, mode);
}
