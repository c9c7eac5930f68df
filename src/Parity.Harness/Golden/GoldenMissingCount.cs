namespace Parity.Harness.Golden;

/// <summary>How many cells of a column hold one missing marker (the summary of a large frame).</summary>
public sealed record GoldenMissingCount(string Column, string Marker, long Count);
