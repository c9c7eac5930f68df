using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary>
/// <c>and</c>, <c>or</c>, <c>not</c>, <c>is null</c> (spec §2.2). Under <c>null</c>: Kleene three-valued logic
/// (SQL, ISO/IEC 9075: <c>null or true</c> = true, <c>null and false</c> = false, otherwise null). Under
/// <c>nan</c>: a missing operand counts as false and the result never holds a missing value.
/// </summary>
public static class Logic
{
    public static Column And(Column left, Column right, Mode mode) => Binary(left, right, mode, isAnd: true);

    public static Column Or(Column left, Column right, Mode mode) => Binary(left, right, mode, isAnd: false);

    public static Column Not(Column operand, Mode mode)
    {
        var (v, m) = Bools(operand, "'not'");
        var n = v.Length;
        var r = new bool[n];
        for (var i = 0; i < n; i++) r[i] = !v[i]; // nan: a missing operand counts as false, so 'not' gives true
        if (m is null || mode.IsNan) return new BoolColumn(r, mode.Missing);
        return new BoolColumn(r, KernelSupport.ValidityOf(m), mode.Missing);
    }

    /// <summary><c>x is null</c> (or <c>is not null</c>): true for any missing marker, in every mode; never missing.</summary>
    public static Column IsMissing(Column operand, bool negated, Mode mode)
    {
        var m = KernelSupport.MissingFlags(operand);
        var r = new bool[operand.Length];
        if (m is not null) Array.Copy(m, r, r.Length);
        if (negated)
            for (var i = 0; i < r.Length; i++) r[i] = !r[i];
        return new BoolColumn(r, mode.Missing);
    }

    private static Column Binary(Column left, Column right, Mode mode, bool isAnd)
    {
        KernelSupport.CheckLength(left, right);
        var what = isAnd ? "'and'" : "'or'";
        var (a, ma) = Bools(left, what);
        var (b, mb) = Bools(right, what);
        var n = a.Length;
        var r = new bool[n];
        if (mode.IsNan || (ma is null && mb is null))
        {
            // Missing cells were read as false.
            if (isAnd) for (var i = 0; i < n; i++) r[i] = a[i] & b[i];
            else for (var i = 0; i < n; i++) r[i] = a[i] | b[i];
            return new BoolColumn(r, mode.Missing);
        }
        var missing = new bool[n];
        for (var i = 0; i < n; i++)
        {
            bool na = ma is not null && ma[i], nb = mb is not null && mb[i];
            if (isAnd)
            {
                // Kleene: false dominates, then null.
                if ((!na && !a[i]) || (!nb && !b[i])) r[i] = false;
                else if (na || nb) missing[i] = true;
                else r[i] = true;
            }
            else
            {
                // Kleene: true dominates, then null.
                if ((!na && a[i]) || (!nb && b[i])) r[i] = true;
                else if (na || nb) missing[i] = true;
                else r[i] = false;
            }
        }
        return new BoolColumn(r, KernelSupport.ValidityOf(missing), mode.Missing);
    }

    /// <summary>Values (missing read as false) and missing flags of a boolean operand; non-booleans are <c>E-TYPE</c>.</summary>
    internal static (bool[] Values, bool[]? Missing) Bools(Column c, string what)
    {
        var n = c.Length;
        var values = new bool[n];
        if (c is BoolColumn bc)
        {
            var m = KernelSupport.MissingFlags(bc);
            bc.Span.CopyTo(values);
            if (m is not null) for (var i = 0; i < n; i++) if (m[i]) values[i] = false;
            return (values, m);
        }
        if (c is ObjectColumn || KernelSupport.AllMissing(c))
        {
            bool[]? missing = null;
            for (var i = 0; i < n; i++)
            {
                var v = c.GetValue(i);
                if (v.IsMissing)
                {
                    missing ??= new bool[n];
                    missing[i] = true;
                    continue;
                }
                if (v.Kind != ValueKind.Bool) throw KernelSupport.TypeError(what, c);
                values[i] = v.Bool;
            }
            return (values, missing);
        }
        throw KernelSupport.TypeError(what, c);
    }
}
