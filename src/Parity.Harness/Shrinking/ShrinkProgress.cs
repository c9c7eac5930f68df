namespace Parity.Harness.Shrinking;

/// <summary>Where a reduction stands after an attempt.</summary>
public readonly record struct ShrinkProgress(string Phase, int Attempts, long Rows, long RowsBefore, TimeSpan Elapsed);
