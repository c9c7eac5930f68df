namespace Parity.Harness.Golden;

/// <summary>
/// A cross-mode finding accepted into the golden store, with the count and footprint (<see cref="AlsoAt"/>)
/// it had then. <see cref="Version"/> 1 entries come from stores written before keys lost their line
/// numbers: they have no statement key and no difference, and are matched by line (docs/golden-format.md).
/// </summary>
public sealed record AcceptedFinding(string Kind, int Line, string? Checkpoint, string? Column, IReadOnlyList<string> Modes, int Count, string Message)
{
    public int Version { get; init; } = GoldenFindingsText.CurrentVersion;

    public string? Statement { get; init; }

    public string Difference { get; init; } = "";

    public IReadOnlyList<string> AlsoAt { get; init; } = [];

    public string? CausedBy { get; init; }

    /// <summary>The identity a current finding must match (<see cref="FindingIdentity.Of(Findings.Finding)"/>).</summary>
    public string Identity => Version == 1
        ? FindingIdentity.OfVersion1(Kind, Line, Checkpoint, Column, Modes)
        : FindingIdentity.Of(Kind, Checkpoint, Statement, Column, Difference, Modes);
}
