namespace Parity.Engine.IO;

/// <summary>How to read one data file (the <c>load ... with (...)</c> options of a script).</summary>
public sealed record LoadOptions
{
    public static LoadOptions Default { get; } = new();

    /// <summary><c>csv</c>, <c>parquet</c> or <c>arrow</c>; null means "by extension".</summary>
    public string? Format { get; init; }

    /// <summary>CSV fields that mean "missing"; null means the default (only the empty field).</summary>
    public IReadOnlyList<string>? MissingTokens { get; init; }

    /// <summary>CSV field separator.</summary>
    public char Delimiter { get; init; } = ',';

    /// <summary>Path shown in error messages (as the user wrote it); defaults to the path loaded.</summary>
    public string? DisplayPath { get; init; }
}
