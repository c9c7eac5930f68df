namespace Parity.Harness.Project;

/// <summary>
/// The defaults of a project, read from <c>parity.json</c> (docs/workflow.md, "Project file"). Every setting
/// is optional; a null setting falls back to the built-in default, and the command line overrides the file.
/// Paths are already resolved against the file's folder.
/// </summary>
public sealed record ProjectFile
{
    /// <summary>The file as it is named in messages (e.g. <c>parity.json</c>).</summary>
    public required string Display { get; init; }

    /// <summary>Script paths or globs, resolved to full paths or full-path globs.</summary>
    public IReadOnlyList<string>? Scripts { get; init; }

    /// <summary>The modes as a comma-separated list (the <c>--modes</c> syntax).</summary>
    public string? Modes { get; init; }

    public string? Golden { get; init; }

    public string? Out { get; init; }

    public IReadOnlyList<string>? Formats { get; init; }

    public double? AbsoluteTolerance { get; init; }

    public double? RelativeTolerance { get; init; }

    public IReadOnlyList<ColumnTolerance> ColumnTolerances { get; init; } = [];

    /// <summary>Golden frames with more rows keep a summary in text and their data in an Arrow IPC file.</summary>
    public int? RowLimit { get; init; }

    /// <summary>Most rows a join or append may produce.</summary>
    public long? MaxRows { get; init; }

    /// <summary>Most UTF-8 bytes of one computed string.</summary>
    public long? MaxStringBytes { get; init; }

    /// <summary>Most changed rows listed per checkpoint in the terminal and Markdown reports.</summary>
    public int? MaxDiffRows { get; init; }

    /// <summary>The size cap of the Markdown report in characters.</summary>
    public int? MaxMarkdownChars { get; init; }

    /// <summary>Rules that mark classes of findings as expected differences of the migration.</summary>
    public IReadOnlyList<ExpectRule> Expect { get; init; } = [];
}
