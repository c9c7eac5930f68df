using System.Runtime.CompilerServices;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Text;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary>
/// <c>= &lt;&gt; &lt; &lt;= &gt; &gt;=</c> (spec §2.2): with a missing operand, under <c>nan</c> every comparison
/// is false except <c>&lt;&gt;</c> (true); under <c>null</c> the result is null. A NaN that is a value
/// (<c>null</c> modes, e.g. 0/0) compares as IEEE 754 says: unordered, so only <c>&lt;&gt;</c> is true.
/// Strings compare in Unicode code point order (UTF-8 byte order for Arrow storage).
/// </summary>
public static partial class Comparison
{
    private const int Unordered = 2;

    public static Column Compare(ComparisonOp op, Column left, Column right, Mode mode)
    {
        KernelSupport.CheckLength(left, right);
        var n = left.Length;
        var missing = KernelSupport.Or(KernelSupport.MissingFlags(left), KernelSupport.MissingFlags(right));
        var result = new bool[n];
        if (n > 0 && !KernelSupport.AllMissing(left) && !KernelSupport.AllMissing(right))
            Fill(op, left, right, mode, result, missing);
        if (missing is not null)
        {
            if (mode.IsNan)
            {
                // nan: a comparison with a missing operand is false, and <> is true.
                var v = op == ComparisonOp.NotEqual;
                for (var i = 0; i < n; i++) if (missing[i]) result[i] = v;
                return new BoolColumn(result, mode.Missing);
            }
            return new BoolColumn(result, KernelSupport.ValidityOf(missing), mode.Missing);
        }
        return new BoolColumn(result, mode.Missing);
    }

    public static string Symbol(ComparisonOp op) => op switch
    {
        ComparisonOp.Equal => "=",
        ComparisonOp.NotEqual => "<>",
        ComparisonOp.Less => "<",
        ComparisonOp.LessOrEqual => "<=",
        ComparisonOp.Greater => ">",
        _ => ">=",
    };

    private static void Fill(ComparisonOp op, Column left, Column right, Mode mode, bool[] result, bool[]? missing)
    {
        switch (left, right)
        {
            case (Int64Column a, Int64Column b):
            {
                ReadOnlySpan<long> x = a.Span, y = b.Span;
                for (var i = 0; i < result.Length; i++) result[i] = Apply(op, x[i].CompareTo(y[i]));
                return;
            }
            case (Int64Column or Float64Column, Int64Column or Float64Column):
            {
                var x = KernelSupport.ToDoubles(left);
                var y = KernelSupport.ToDoubles(right);
                for (var i = 0; i < result.Length; i++) result[i] = Apply(op, CompareDoubles(x[i], y[i]));
                return;
            }
            case (TimestampColumn a, TimestampColumn b):
            {
                ReadOnlySpan<long> x = a.Span, y = b.Span;
                for (var i = 0; i < result.Length; i++) result[i] = Apply(op, x[i].CompareTo(y[i]));
                return;
            }
            case (BoolColumn a, BoolColumn b):
            {
                ReadOnlySpan<bool> x = a.Span, y = b.Span;
                for (var i = 0; i < result.Length; i++) result[i] = Apply(op, x[i].CompareTo(y[i]));
                return;
            }
            case (Utf8Column a, Utf8Column b):
                CompareUtf8(op, a, b, result, missing);
                return;
            case (ObjectColumn, _):
            case (_, ObjectColumn):
                CompareCells(op, left, right, mode, result, missing);
                return;
            default:
                throw new EngineException(ErrorCodes.Type,
                    $"cannot compare a {left.TypeLabel} column with a {right.TypeLabel} value using '{Symbol(op)}'");
        }
    }

    private static void CompareUtf8(ComparisonOp op, Utf8Column a, Utf8Column b, bool[] result, bool[]? missing)
    {
        ReadOnlySpan<int> oa = a.Offsets, ob = b.Offsets;
        ReadOnlySpan<byte> da = a.Data, db = b.Data;
        var equality = op is ComparisonOp.Equal or ComparisonOp.NotEqual;
        for (var i = 0; i < result.Length; i++)
        {
            if (missing is not null && missing[i]) continue;
            var x = da[oa[i]..oa[i + 1]];
            var y = db[ob[i]..ob[i + 1]];
            // UTF-8 byte order is code point order (Unicode Standard §2.5, "UTF-8" properties).
            result[i] = equality ? x.SequenceEqual(y) == (op == ComparisonOp.Equal) : Apply(op, Math.Sign(x.SequenceCompareTo(y)));
        }
    }

    /// <summary>Boxed cells: values of one kind compare; unequal kinds are unequal, and ordering them is <c>E-TYPE</c>.</summary>
    private static void CompareCells(ComparisonOp op, Column left, Column right, Mode mode, bool[] result, bool[]? missing)
    {
        var bad = -1;
        for (var i = 0; i < result.Length; i++)
        {
            if (missing is not null && missing[i]) continue;
            var c = CompareValues(left.GetValue(i), right.GetValue(i));
            if (c == int.MinValue)
            {
                if (op is ComparisonOp.Equal or ComparisonOp.NotEqual) { result[i] = op == ComparisonOp.NotEqual; continue; }
                if (bad < 0) bad = i;
                continue;
            }
            result[i] = Apply(op, c);
        }
        if (bad >= 0)
            throw new EngineException(ErrorCodes.Type,
                $"cannot order {Kind(left.GetValue(bad))} and {Kind(right.GetValue(bad))} with '{Symbol(op)}' (row {bad})");
        _ = mode;
    }

    private static string Kind(Value v) => v.Kind.ToString().ToLowerInvariant();

    /// <summary>-1/0/1, <see cref="Unordered"/> for a NaN value, int.MinValue when the kinds do not compare.</summary>
    internal static int CompareValues(Value a, Value b)
    {
        if (a.IsNumber && b.IsNumber)
        {
            if (a.Kind == ValueKind.Int64 && b.Kind == ValueKind.Int64) return a.Int64.CompareTo(b.Int64);
            return CompareDoubles(a.AsDouble, b.AsDouble);
        }
        if (a.Kind != b.Kind) return int.MinValue;
        return a.Kind switch
        {
            ValueKind.String => Math.Sign(CodePointOrder.Compare(a.String, b.String)),
            ValueKind.Bool => a.Bool.CompareTo(b.Bool),
            ValueKind.Timestamp => a.TimestampMicros.CompareTo(b.TimestampMicros),
            _ => int.MinValue,
        };
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static int CompareDoubles(double x, double y) =>
        x < y ? -1 : x > y ? 1 : x == y ? 0 : Unordered; // IEEE 754: NaN is unordered with everything

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static bool Apply(ComparisonOp op, int c)
    {
        if (c == Unordered) return op == ComparisonOp.NotEqual;
        return op switch
        {
            ComparisonOp.Equal => c == 0,
            ComparisonOp.NotEqual => c != 0,
            ComparisonOp.Less => c < 0,
            ComparisonOp.LessOrEqual => c <= 0,
            ComparisonOp.Greater => c > 0,
            _ => c >= 0,
        };
    }
}
