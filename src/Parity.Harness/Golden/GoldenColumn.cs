namespace Parity.Harness.Golden;

/// <summary>A column of a golden frame: its name and the type label of spec §2.1.</summary>
public sealed record GoldenColumn(string Name, string Type);
