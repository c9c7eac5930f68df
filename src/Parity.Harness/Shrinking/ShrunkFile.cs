namespace Parity.Harness.Shrinking;

/// <summary>One data file of a reduced fixture: what was kept of the original and where the copy was written.</summary>
public sealed record ShrunkFile
{
    /// <summary>The path as the script's load statement wrote it.</summary>
    public required string Source { get; init; }

    /// <summary>The reduced copy, relative to the reduced script (forward slashes).</summary>
    public required string Output { get; init; }

    /// <summary><c>csv</c>, <c>parquet</c> or <c>arrow</c> (the original's format).</summary>
    public required string Format { get; init; }

    public required int RowsBefore { get; init; }

    /// <summary>The original rows kept, numbered from 0, ascending.</summary>
    public required IReadOnlyList<int> KeptRows { get; init; }

    public required IReadOnlyList<string> ColumnsBefore { get; init; }

    public required IReadOnlyList<string> KeptColumns { get; init; }
}
