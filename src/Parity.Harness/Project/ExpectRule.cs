using Parity.Harness.Findings;
using Parity.Harness.Project.Internal;

namespace Parity.Harness.Project;

/// <summary>
/// One <c>expect</c> rule of the project file: a finding that matches every matcher given is an expected
/// difference of the migration (docs/workflow.md, "Expected differences"). Globs use <c>*</c>, <c>?</c>, <c>**</c>.
/// </summary>
public sealed record ExpectRule
{
    /// <summary>Where the rule starts in the project file, e.g. <c>parity.json:14:5</c>: how reports name it.</summary>
    public required string Location { get; init; }

    public FindingKind? Kind { get; init; }

    /// <summary>A glob over the script path relative to the working directory (forward slashes).</summary>
    public string? Script { get; init; }

    /// <summary>A glob over the checkpoint label; a statement finding (no checkpoint) never matches it.</summary>
    public string? Checkpoint { get; init; }

    /// <summary>Globs over the column name; a finding without a column never matches them.</summary>
    public IReadOnlyList<string>? Columns { get; init; }

    /// <summary>The first mode's side of every difference (a type label or missing marker).</summary>
    public string? From { get; init; }

    /// <summary>The second mode's side of every difference.</summary>
    public string? To { get; init; }

    /// <summary>Why the difference is expected, for people reading the file and the reports.</summary>
    public string? Note { get; init; }

    /// <summary>The glob rule of the project file (<c>*</c>, <c>?</c>, <c>**</c>), for column and script patterns.</summary>
    public static bool GlobMatches(string pattern, string text) => Glob.IsMatch(pattern, text);

    /// <summary>
    /// True when <paramref name="finding"/> meets every matcher. With <see cref="From"/> or <see cref="To"/>
    /// the finding must record differences and every one of them must agree, so a new kind of difference
    /// that joins an expected group is never hidden.
    /// </summary>
    public bool Matches(Finding finding)
    {
        if (Kind is { } kind && finding.Kind != kind) return false;
        if (Script is not null && !Glob.IsMatch(Script, finding.Script)) return false;
        if (Checkpoint is not null && (finding.Checkpoint is null || !Glob.IsMatch(Checkpoint, finding.Checkpoint))) return false;
        if (Columns is not null)
        {
            if (finding.Column is null) return false;
            var any = false;
            foreach (var g in Columns)
                if (Glob.IsMatch(g, finding.Column)) { any = true; break; }
            if (!any) return false;
        }
        if (From is null && To is null) return true;
        if (finding.FromTo.Count == 0) return false;
        foreach (var d in finding.FromTo)
        {
            if (From is not null && !string.Equals(From, d.From, StringComparison.Ordinal)) return false;
            if (To is not null && !string.Equals(To, d.To, StringComparison.Ordinal)) return false;
        }
        return true;
    }
}
