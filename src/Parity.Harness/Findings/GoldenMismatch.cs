namespace Parity.Harness.Findings;

/// <summary>
/// A difference between a run and its approved golden snapshot, found by comparing data, never lines of
/// text (docs/golden-format.md, "Comparing with golden"): for one script, mode and checkpoint (null for the
/// statement records and the accepted-findings file) the exact counts, the schema changes, and the changes
/// themselves up to a cap. <see cref="Message"/> says it in one line; <see cref="Excerpt"/> is kept for
/// mismatches that are not about data (an unreadable file).
/// </summary>
public sealed record GoldenMismatch(string Script, string? Checkpoint, string Mode, string Message, string Excerpt)
{
    /// <summary><c>frame</c>, <c>schema</c>, <c>records</c>, <c>missing-golden</c> or <c>stale-golden</c>.</summary>
    public string Kind { get; init; } = GoldenMismatchKinds.Frame;

    /// <summary>Rows in the golden frame (null when there is none).</summary>
    public long? RowsGolden { get; init; }

    /// <summary>Rows in the current frame (null when the run did not reach the checkpoint).</summary>
    public long? RowsNow { get; init; }

    public long RowsAdded { get; init; }

    public long RowsRemoved { get; init; }

    public long RowsChanged { get; init; }

    public long CellsChanged { get; init; }

    /// <summary>Cells changed per column (only columns with changes), in frame order.</summary>
    public IReadOnlyList<KeyValuePair<string, long>> Columns { get; init; } = [];

    public GoldenSchemaChange Schema { get; init; } = GoldenSchemaChange.None;

    /// <summary>Changed cells, added and removed rows, changed records: the first ones, up to the listing cap.</summary>
    public IReadOnlyList<GoldenChange> Changes { get; init; } = [];

    /// <summary>How many changes exist beyond <see cref="Changes"/>.</summary>
    public long Truncated { get; init; }

    /// <summary>Rows for a side-by-side listing (changed, added and removed rows in alignment order), up to the listing cap.</summary>
    public IReadOnlyList<GoldenRowChange> Rows { get; init; } = [];

    /// <summary>The golden frame's column names (for the side-by-side listing).</summary>
    public IReadOnlyList<string> GoldenColumns { get; init; } = [];

    /// <summary>The current frame's column names (for the side-by-side listing).</summary>
    public IReadOnlyList<string> NowColumns { get; init; } = [];

    /// <summary>The key columns rows were aligned by (empty: aligned by whole-row hashes).</summary>
    public IReadOnlyList<string> Keys { get; init; } = [];
}
