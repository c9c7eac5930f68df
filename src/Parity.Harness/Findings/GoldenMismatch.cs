namespace Parity.Harness.Findings;

/// <summary>
/// A difference between a run and its approved golden snapshot (or a missing snapshot): the checkpoint
/// (or <c>null</c> for the accepted-findings file), the mode, and a short line-diff excerpt.
/// </summary>
public sealed record GoldenMismatch(string Script, string? Checkpoint, string Mode, string Message, string Excerpt);
