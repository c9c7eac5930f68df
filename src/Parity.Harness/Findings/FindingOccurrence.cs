namespace Parity.Harness.Findings;

/// <summary>One checkpoint where a grouped difference appears, with its count there (the first, then each of <see cref="Finding.AlsoAt"/>).</summary>
public sealed record FindingOccurrence(string Checkpoint, int Line, int Count);
