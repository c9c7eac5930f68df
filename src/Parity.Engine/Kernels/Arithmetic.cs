using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;

namespace Parity.Engine.Kernels;

/// <summary>
/// <c>+ - * / %</c> and negation (spec §2.3): int64 with int64 stays int64 and overflow is <c>E-OVERFLOW</c>;
/// an int and a float give float64; <c>/</c> is always float64 with IEEE 754 results (x/0 = ±Infinity,
/// 0/0 = NaN); <c>%</c> is floored (the result has the sign of the divisor). A missing operand gives a
/// missing result in every mode.
/// </summary>
public static class Arithmetic
{
    public static Column Binary(ArithmeticOp op, Column left, Column right, Mode mode)
    {
        KernelSupport.CheckLength(left, right);
        var what = "'" + Symbol(op) + "'";
        var a = KernelSupport.AsNumeric(left, mode, what);
        var b = KernelSupport.AsNumeric(right, mode, what);
        var missing = KernelSupport.Or(KernelSupport.MissingFlags(a), KernelSupport.MissingFlags(b));
        if (op != ArithmeticOp.Divide && a is Int64Column ia && b is Int64Column ib)
        {
            if (op == ArithmeticOp.Modulo && HasZero(ib, missing)) return Floats(op, a, b, missing, mode);
            var data = new long[a.Length];
            var overflow = IntLoop(op, ia.Span, ib.Span, data, missing);
            if (overflow >= 0)
                throw new EngineException(ErrorCodes.Overflow,
                    $"int64 overflow in '{Symbol(op)}' at row {overflow}");
            return KernelSupport.Int(data, missing, mode);
        }
        return Floats(op, a, b, missing, mode);
    }

    /// <summary>Unary minus.</summary>
    public static Column Negate(Column operand, Mode mode)
    {
        var a = KernelSupport.AsNumeric(operand, mode, "'-'");
        var missing = KernelSupport.MissingFlags(a);
        if (a is Int64Column ia)
        {
            var src = ia.Span;
            var data = new long[src.Length];
            var overflow = -1;
            for (var i = 0; i < src.Length; i++)
            {
                if (missing is not null && missing[i]) continue;
                if (src[i] == long.MinValue && overflow < 0) overflow = i;
                data[i] = unchecked(-src[i]);
            }
            if (overflow >= 0) throw new EngineException(ErrorCodes.Overflow, $"int64 overflow in '-' at row {overflow}");
            return KernelSupport.Int(data, missing, mode);
        }
        var d = KernelSupport.ToDoubles(a);
        for (var i = 0; i < d.Length; i++) d[i] = -d[i];
        return KernelSupport.Float(d, missing, mode);
    }

    public static string Symbol(ArithmeticOp op) => op switch
    {
        ArithmeticOp.Add => "+",
        ArithmeticOp.Subtract => "-",
        ArithmeticOp.Multiply => "*",
        ArithmeticOp.Divide => "/",
        _ => "%",
    };

    private static bool HasZero(Int64Column b, bool[]? missing)
    {
        var s = b.Span;
        for (var i = 0; i < s.Length; i++)
            if (s[i] == 0 && (missing is null || !missing[i])) return true;
        return false;
    }

    /// <summary>Returns the first overflowing row, or -1. Overflow is detected without checked arithmetic so the loop never throws.</summary>
    private static int IntLoop(ArithmeticOp op, ReadOnlySpan<long> a, ReadOnlySpan<long> b, Span<long> r, bool[]? missing)
    {
        var n = r.Length;
        var first = -1;
        switch (op)
        {
            case ArithmeticOp.Add:
                for (var i = 0; i < n; i++)
                {
                    long x = a[i], y = b[i], s = unchecked(x + y);
                    r[i] = s;
                    if (((x ^ s) & (y ^ s)) < 0 && first < 0 && (missing is null || !missing[i])) first = i;
                }
                break;
            case ArithmeticOp.Subtract:
                for (var i = 0; i < n; i++)
                {
                    long x = a[i], y = b[i], s = unchecked(x - y);
                    r[i] = s;
                    if (((x ^ y) & (x ^ s)) < 0 && first < 0 && (missing is null || !missing[i])) first = i;
                }
                break;
            case ArithmeticOp.Multiply:
                for (var i = 0; i < n; i++)
                {
                    var high = Math.BigMul(a[i], b[i], out var low);
                    r[i] = low;
                    if (high != (low >> 63) && first < 0 && (missing is null || !missing[i])) first = i;
                }
                break;
            default:
                for (var i = 0; i < n; i++)
                {
                    long x = a[i], y = b[i];
                    if (y == 0 || y == -1) { r[i] = 0; continue; } // x % -1 is 0; a zero divisor is a missing row here
                    var m = x % y;
                    if (m != 0 && (m ^ y) < 0) m += y;
                    r[i] = m;
                }
                break;
        }
        return first;
    }

    private static Column Floats(ArithmeticOp op, Column a, Column b, bool[]? missing, Mode mode)
    {
        var x = KernelSupport.ToDoubles(a);
        var y = KernelSupport.ToDoubles(b);
        var n = x.Length;
        var r = x; // in place: x is a fresh array
        switch (op)
        {
            case ArithmeticOp.Add:
                for (var i = 0; i < n; i++) r[i] = x[i] + y[i];
                break;
            case ArithmeticOp.Subtract:
                for (var i = 0; i < n; i++) r[i] = x[i] - y[i];
                break;
            case ArithmeticOp.Multiply:
                for (var i = 0; i < n; i++) r[i] = x[i] * y[i];
                break;
            case ArithmeticOp.Divide:
                // IEEE 754 division: x/0 = ±Infinity, 0/0 = NaN.
                for (var i = 0; i < n; i++) r[i] = x[i] / y[i];
                break;
            default:
                for (var i = 0; i < n; i++) r[i] = FlooredMod(x[i], y[i]);
                break;
        }
        return KernelSupport.Float(r, missing, mode);
    }

    /// <summary>Floored modulo: the remainder takes the sign of the divisor; x % 0 is NaN (IEEE 754 remainder).</summary>
    public static double FlooredMod(double x, double y)
    {
        var m = x % y;
        if (m != 0 && (m < 0) != (y < 0)) m += y;
        return m;
    }
}
