using Parity.Script.Running;

namespace Parity.Harness.Golden;

/// <summary>
/// What a golden run file records about one mode: the checkpoints reached in order, the aliasing set of every
/// write, the warnings with the frames they reached, the counted notes and the error that stopped the mode.
/// </summary>
public sealed record GoldenRun
{
    public required string Mode { get; init; }

    public required IReadOnlyList<string> Checkpoints { get; init; }

    public required IReadOnlyList<WriteRecord> Writes { get; init; }

    public required IReadOnlyList<RunWarning> Warnings { get; init; }

    public required IReadOnlyList<RunNote> Notes { get; init; }

    public GoldenFailure? Failure { get; init; }

    /// <summary>The statement records, each keyed by its statement (docs/golden-format.md, "Run files").</summary>
    public IReadOnlyList<GoldenRecord> Records { get; init; } = [];

    /// <summary>The file's format version (1: records named by line only).</summary>
    public int Version { get; init; } = GoldenRunText.CurrentVersion;
}
