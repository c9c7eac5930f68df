namespace Parity.Harness.Findings;

/// <summary>A checkpoint frame's shape in one mode: row count and (name, type label) per column in order.</summary>
public sealed record CheckpointShape(int Rows, IReadOnlyList<ColumnShape> Columns);
