namespace Parity.Script.Running;

/// <summary>Settings for one interpreter run.</summary>
public sealed record RunOptions
{
    public static RunOptions Default { get; } = new();

    /// <summary>Load paths may not escape this folder unless <see cref="AllowOutsideRoot"/>; null means the current directory.</summary>
    public string? Root { get; init; }

    public bool AllowOutsideRoot { get; init; }

    /// <summary>Most rows a derived frame (a join, an append) may have before the run stops with E-LIMIT.</summary>
    public long MaxRows { get; init; } = 200_000_000;

    /// <summary>
    /// Whether loads keep their parsed form cached for another mode's run of the same files
    /// (<see cref="Parity.Engine.IO.LoadOptions.KeepParsed"/>); false for the last or only mode.
    /// </summary>
    public bool KeepParsedSources { get; init; } = true;

    /// <summary>
    /// Where loads get their tables instead of reading the file: given the resolved full path, the load's
    /// options and the mode, a table, or null to read the file as usual. <c>parity shrink</c> hands over cut-down
    /// copies of tables it read once (docs/workflow.md); path checks still apply first.
    /// </summary>
    public Func<string, Parity.Engine.IO.LoadOptions, Parity.Engine.Modes.Mode, Parity.Engine.Frames.Table?>? TableSource { get; init; }

    /// <summary>Most UTF-8 bytes one string cell may have before the run stops with E-LIMIT.</summary>
    public long MaxStringBytes { get; init; } = 256L * 1024 * 1024;
}
