namespace Parity.Engine.Operations.Internal;

/// <summary>
/// One column's cells as dense ranks in ascending value order (the order of <see cref="Sorting"/>): 0 ..
/// <see cref="ValueCount"/> - 1 for values, equal values share a rank. A NaN that is a value (null modes)
/// takes the last value rank. A missing cell is -1, or -2 for a boxed <c>None</c> under <c>nan</c> modes
/// (so that <see cref="Distinct"/> can keep the two markers apart).
/// </summary>
internal readonly struct KeyRanks(int[] ranks, int valueCount, bool hasNaNValue)
{
    public int[] Ranks { get; } = ranks;

    public int ValueCount { get; } = valueCount;

    public bool HasNaNValue { get; } = hasNaNValue;

    /// <summary>Values other than the NaN value: ranks below this are ordinary values.</summary>
    public int OrdinaryCount => HasNaNValue ? ValueCount - 1 : ValueCount;
}
