namespace Parity.Harness.Findings;

public sealed record ColumnShape(string Name, string Type);
