namespace Parity.Harness.Findings;

/// <summary>A checkpoint of a script: its label, line and, per mode that reached it, rows and column types.</summary>
public sealed record CheckpointSummary(string Label, int Line, IReadOnlyDictionary<string, CheckpointShape> PerMode);
