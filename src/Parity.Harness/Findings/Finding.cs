using System.Globalization;

namespace Parity.Harness.Findings;

/// <summary>
/// A group of differences between two modes, with a count, a few samples side by side and a one-line
/// migration hint. A checkpoint finding belongs to (checkpoint, column, kind, difference); a statement
/// finding (alias, warning, error, rows dropped) to (statement, kind, difference). <see cref="Key"/>
/// identifies the finding across runs and never contains a line number (docs/workflow.md, "Finding keys").
/// </summary>
public sealed record Finding
{
    public required FindingKind Kind { get; init; }

    /// <summary>The script path as given relative to the working directory, with forward slashes.</summary>
    public required string Script { get; init; }

    /// <summary>1-based line of the checkpoint or statement where the finding first appears (for people; not part of the key).</summary>
    public required int Line { get; init; }

    /// <summary>The checkpoint label, or null for statement-level findings (writes, warnings, errors, rows dropped).</summary>
    public string? Checkpoint { get; init; }

    /// <summary>
    /// The statement's key (<c>'canonical text' #occurrence</c>, see <c>StatementKeys</c>) for a statement
    /// finding; null for a checkpoint finding.
    /// </summary>
    public string? Statement { get; init; }

    /// <summary>The column, or null when the finding is about the whole frame or statement.</summary>
    public string? Column { get; init; }

    /// <summary>
    /// The difference itself, without counts or rows (<c>object in legacy, utf8 in modern</c>,
    /// <c>NaN in legacy where modern has null</c>, <c>values differ</c>): part of the key, and what makes a
    /// later checkpoint's difference a recurrence of this one.
    /// </summary>
    public string Difference { get; init; } = "";

    /// <summary>The total count: at the first checkpoint and every one in <see cref="AlsoAt"/>.</summary>
    public required int Count { get; init; }

    public FindingStatus Status { get; init; } = FindingStatus.New;

    public required string Message { get; init; }

    public required string Hint { get; init; }

    /// <summary>The two modes compared, in canonical order (nearer legacy first).</summary>
    public required IReadOnlyList<string> Modes { get; init; }

    public IReadOnlyList<FindingSample> Samples { get; init; } = [];

    /// <summary>The distinct differences of a <c>type</c> or <c>missing</c> finding, in first-seen order; empty for other kinds.</summary>
    public IReadOnlyList<FindingDifference> FromTo { get; init; } = [];

    /// <summary>The count recorded in the golden store when the finding was accepted (for <see cref="FindingStatus.Changed"/>).</summary>
    public int? AcceptedCount { get; init; }

    /// <summary>Later checkpoints where the same difference recurs (same kind, column and difference), in script order.</summary>
    public IReadOnlyList<string> AlsoAt { get; init; } = [];

    /// <summary>Where a checkpoint finding appears, with the count at each checkpoint (first, then <see cref="AlsoAt"/>); empty for statement findings.</summary>
    public IReadOnlyList<FindingOccurrence> Occurrences { get; init; } = [];

    /// <summary>For value and missing differences that first appear after a write whose aliasing sets differ: that write's finding key.</summary>
    public string? CausedBy { get; init; }

    /// <summary>The line of the write in <see cref="CausedBy"/> (for people).</summary>
    public int? CausedByLine { get; init; }

    /// <summary>
    /// <c>kind|script|checkpoint 'label'|column 'c'|difference|modeA,modeB</c>, or with <c>statement 'text' #n</c>
    /// in place of the checkpoint; <c>-</c> for no column. No line number, no count.
    /// </summary>
    public string Key => KindLabel + "|" + Script + "|" + Place + "|" + (Column is null ? "-" : "column " + Quote(Column)) + "|" + Difference + "|" + string.Join(",", Modes);

    /// <summary><c>checkpoint 'label'</c> or <c>statement 'text' #n</c> (or <c>line N</c> for a run recorded without statements).</summary>
    public string Place => Checkpoint is not null ? "checkpoint " + Quote(Checkpoint) : "statement " + (Statement ?? "'line " + Line.ToString(CultureInfo.InvariantCulture) + "' #1");

    public string KindLabel => Kind.ToString().ToLowerInvariant();

    private static string Quote(string s) => "'" + s.Replace("'", "''", StringComparison.Ordinal) + "'";
}
