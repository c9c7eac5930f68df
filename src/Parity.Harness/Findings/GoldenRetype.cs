namespace Parity.Harness.Findings;

/// <summary>A column whose type label differs between the golden frame and now.</summary>
public sealed record GoldenRetype(string Column, string Golden, string Now);
