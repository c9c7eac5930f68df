namespace Parity.Harness.Findings;

/// <summary>
/// A group of differences between modes for one (script, checkpoint or line, column, kind), with a count,
/// a few samples side by side and a one-line migration hint. <see cref="Key"/> identifies the group
/// across runs (it is what the golden store accepts); it does not include the count.
/// </summary>
public sealed record Finding
{
    public required FindingKind Kind { get; init; }

    /// <summary>The script path as given relative to the working directory, with forward slashes.</summary>
    public required string Script { get; init; }

    /// <summary>1-based line of the checkpoint or statement.</summary>
    public required int Line { get; init; }

    /// <summary>The checkpoint label, or null for statement-level findings (writes, warnings, errors).</summary>
    public string? Checkpoint { get; init; }

    /// <summary>The column, or null when the finding is about the whole frame or statement.</summary>
    public string? Column { get; init; }

    public required int Count { get; init; }

    public FindingStatus Status { get; init; } = FindingStatus.New;

    public required string Message { get; init; }

    public required string Hint { get; init; }

    /// <summary>The modes compared, by name (<c>legacy</c>, <c>modern</c> or a spelling).</summary>
    public required IReadOnlyList<string> Modes { get; init; }

    public IReadOnlyList<FindingSample> Samples { get; init; } = [];

    /// <summary>The count recorded in the golden store when the finding was accepted (for <see cref="FindingStatus.Changed"/>).</summary>
    public int? AcceptedCount { get; init; }

    public string Key => KindLabel + "|" + Script + "|" + (Checkpoint ?? ("line " + Line.ToString(System.Globalization.CultureInfo.InvariantCulture))) + "|" + (Column ?? "");

    public string KindLabel => Kind.ToString().ToLowerInvariant();
}
