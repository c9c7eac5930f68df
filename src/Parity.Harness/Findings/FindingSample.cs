namespace Parity.Harness.Findings;

/// <summary>
/// One sample row of a finding: the 0-based row index in the checkpoint frame (null for statement-level
/// findings) and each compared mode's value as display text, in the order of <see cref="Finding.Modes"/>.
/// </summary>
public sealed record FindingSample(int? Row, IReadOnlyList<string> Values);
