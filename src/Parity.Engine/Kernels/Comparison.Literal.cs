using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

public static partial class Comparison
{
    /// <summary>
    /// <c>column op literal</c> without broadcasting the literal into a column. Fast paths for Arrow strings
    /// against a string and for int64/float64 against a number; every other case (boxed cells, a missing
    /// literal, mixed kinds) runs the column overload over a broadcast literal, so the rules of spec §2.2
    /// stay in one place and both paths give the same column.
    /// </summary>
    public static Column Compare(ComparisonOp op, Column left, Value right, Mode mode)
    {
        switch (left)
        {
            case Utf8Column u when right.Kind == ValueKind.String:
            {
                var result = GC.AllocateUninitializedArray<bool>(u.Length);
                Utf8Scans.Compare(u, System.Text.Encoding.UTF8.GetBytes(right.String), op, result);
                return StringKernels.Utf8Result(u, result, op == ComparisonOp.NotEqual, mode);
            }
            case Int64Column i when right.IsNumber && i.Marker == mode.Missing:
                return Numeric(op, i.Span, i.Validity, right, mode);
            case Float64Column f when right.IsNumber && !double.IsNaN(right.AsDouble) && f.Marker == mode.Missing
                                      && (mode.IsNull || !f.Validity.HasBitmap):
                return Numeric(op, f.Span, f.Validity, right, mode);
        }
        return Compare(op, left, Broadcast.Literal(right, left.Length, mode), mode);
    }

    /// <summary><c>literal op column</c>: the same comparison with the operands swapped (IEEE 754 order is symmetric).</summary>
    public static Column Compare(ComparisonOp op, Value left, Column right, Mode mode) =>
        Compare(Swap(op), right, left, mode);

    private static ComparisonOp Swap(ComparisonOp op) => op switch
    {
        ComparisonOp.Less => ComparisonOp.Greater,
        ComparisonOp.LessOrEqual => ComparisonOp.GreaterOrEqual,
        ComparisonOp.Greater => ComparisonOp.Less,
        ComparisonOp.GreaterOrEqual => ComparisonOp.LessOrEqual,
        _ => op,
    };

    private static Column Numeric(ComparisonOp op, ReadOnlySpan<long> x, Validity validity, Value literal, Mode mode)
    {
        var result = GC.AllocateUninitializedArray<bool>(x.Length);
        if (literal.Kind == ValueKind.Int64) CompareValues(op, x, literal.Int64, result);
        else CompareLongsWithDouble(op, x, literal.Float64, result);
        return NumericResult(op, result, validity, mode);
    }

    private static Column Numeric(ComparisonOp op, ReadOnlySpan<double> x, Validity validity, Value literal, Mode mode)
    {
        var result = GC.AllocateUninitializedArray<bool>(x.Length);
        CompareValues(op, x, literal.AsDouble, result);
        return NumericResult(op, result, validity, mode);
    }

    /// <summary>
    /// Missing rows of a numeric column: under <c>null</c> the result keeps the input's validity; under
    /// <c>nan</c> a float column marks missing with NaN, which the IEEE 754 operators already answer as the
    /// rule wants (false, and true for <c>&lt;&gt;</c>), and an int64 column has no missing rows.
    /// </summary>
    private static BoolColumn NumericResult(ComparisonOp op, bool[] result, Validity validity, Mode mode)
    {
        if (!validity.HasBitmap || validity.NullCount == 0) return new BoolColumn(result, mode.Missing);
        if (mode.IsNull) return new BoolColumn(result, validity.Compact(), mode.Missing);
        var compact = validity.Compact();
        Utf8Scans.FillMissing(compact, result, op == ComparisonOp.NotEqual);
        return new BoolColumn(result, mode.Missing);
    }

    // One loop per operator so each inner loop is a plain compare and store; the JIT specialises it per
    // value type. For doubles the operators are IEEE 754's: a NaN is unordered, so all but != are false.
    private static void CompareValues<T>(ComparisonOp op, ReadOnlySpan<T> x, T y, Span<bool> r)
        where T : System.Numerics.IComparisonOperators<T, T, bool>
    {
        r = r[..x.Length];
        switch (op)
        {
            case ComparisonOp.Equal: for (var i = 0; i < x.Length; i++) r[i] = x[i] == y; break;
            case ComparisonOp.NotEqual: for (var i = 0; i < x.Length; i++) r[i] = x[i] != y; break;
            case ComparisonOp.Less: for (var i = 0; i < x.Length; i++) r[i] = x[i] < y; break;
            case ComparisonOp.LessOrEqual: for (var i = 0; i < x.Length; i++) r[i] = x[i] <= y; break;
            case ComparisonOp.Greater: for (var i = 0; i < x.Length; i++) r[i] = x[i] > y; break;
            default: for (var i = 0; i < x.Length; i++) r[i] = x[i] >= y; break;
        }
    }

    // An int64 against a float literal compares as doubles, exactly as the column path does.
    private static void CompareLongsWithDouble(ComparisonOp op, ReadOnlySpan<long> x, double y, Span<bool> r)
    {
        r = r[..x.Length];
        switch (op)
        {
            case ComparisonOp.Equal: for (var i = 0; i < x.Length; i++) r[i] = (double)x[i] == y; break;
            case ComparisonOp.NotEqual: for (var i = 0; i < x.Length; i++) r[i] = (double)x[i] != y; break;
            case ComparisonOp.Less: for (var i = 0; i < x.Length; i++) r[i] = (double)x[i] < y; break;
            case ComparisonOp.LessOrEqual: for (var i = 0; i < x.Length; i++) r[i] = (double)x[i] <= y; break;
            case ComparisonOp.Greater: for (var i = 0; i < x.Length; i++) r[i] = (double)x[i] > y; break;
            default: for (var i = 0; i < x.Length; i++) r[i] = (double)x[i] >= y; break;
        }
    }
}
