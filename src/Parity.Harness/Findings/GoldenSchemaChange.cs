namespace Parity.Harness.Findings;

/// <summary>Columns added, removed, re-typed (type label in golden and now), and shared columns whose relative order changed.</summary>
public sealed record GoldenSchemaChange(IReadOnlyList<string> Added, IReadOnlyList<string> Removed, IReadOnlyList<GoldenRetype> Retyped, IReadOnlyList<string> Moved)
{
    public static GoldenSchemaChange None { get; } = new([], [], [], []);

    public bool IsEmpty => Added.Count == 0 && Removed.Count == 0 && Retyped.Count == 0 && Moved.Count == 0;
}
