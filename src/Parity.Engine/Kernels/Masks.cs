using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary>Turns a condition column into the rows it selects (spec §2.2 "A row whose filter condition is null is not kept").</summary>
public static class Masks
{
    /// <summary>
    /// True where the condition is true. A null condition selects nothing and is counted in
    /// <paramref name="nullCount"/>. Under <c>nan</c> an object condition holding a missing value (a boxed
    /// string predicate on a missing cell) is <c>E-MASK-MISSING</c>, as legacy stacks refuse such a mask.
    /// </summary>
    public static bool[] Select(Column condition, Mode mode, out int nullCount)
    {
        var n = condition.Length;
        var keep = new bool[n];
        nullCount = 0;
        if (condition is BoolColumn b)
        {
            b.Span.CopyTo(keep);
            if (b.Validity.HasBitmap)
            {
                for (var i = 0; i < n; i++)
                {
                    if (b.Validity.IsValid(i)) continue;
                    keep[i] = false;
                    nullCount++;
                }
            }
            return keep;
        }
        if (condition is ObjectColumn || KernelSupport.AllMissing(condition))
        {
            for (var i = 0; i < n; i++)
            {
                var v = condition.GetValue(i);
                if (v.IsMissing)
                {
                    if (mode.IsNan && condition is ObjectColumn)
                        throw new EngineException(ErrorCodes.MaskMissing,
                            $"the condition holds a missing value ({ValueText.MissingName(v.Missing)}) at row {i}; it cannot select rows");
                    nullCount++;
                    continue;
                }
                if (v.Kind != ValueKind.Bool)
                    throw new EngineException(ErrorCodes.Type, $"a condition must be bool, not a {condition.TypeLabel} column");
                keep[i] = v.Bool;
            }
            return keep;
        }
        throw new EngineException(ErrorCodes.Type, $"a condition must be bool, not a {condition.TypeLabel} column");
    }
}
