namespace Parity.Harness.Reports;

/// <summary>How much the terminal summary shows.</summary>
public sealed record TerminalOptions
{
    public static TerminalOptions Default { get; } = new();

    /// <summary>List accepted and expected findings one line each instead of one count line per script (<c>--show-accepted</c>).</summary>
    public bool ShowAccepted { get; init; }

    /// <summary>Only the per-script lines and the last lines (<c>--quiet</c>).</summary>
    public bool Quiet { get; init; }

    /// <summary>Most rows listed per golden mismatch (<c>--max-diff-rows</c>); counts are always exact.</summary>
    public int MaxDiffRows { get; init; } = GoldenDiffText.DefaultMaxRows;
}
