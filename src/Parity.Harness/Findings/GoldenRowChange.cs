namespace Parity.Harness.Findings;

/// <summary>
/// One row of a golden diff listing: the golden row and the current row side by side (either missing for an
/// added or removed row), cells in the golden text form in each frame's column order, and which current
/// columns changed (by name) so every format can mark them.
/// </summary>
public sealed record GoldenRowChange(long? RowGolden, long? RowNow, IReadOnlyList<string>? Golden, IReadOnlyList<string>? Now, IReadOnlyList<string> ChangedColumns);
