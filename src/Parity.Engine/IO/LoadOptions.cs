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

    /// <summary>
    /// Whether the parsed, mode-neutral form stays in the loader's cache for the next mode to convert. A run
    /// of the last (or only) mode says false: the cached form would sit next to the table it became, which
    /// under a boxed mode is gigabytes on a large file, and a cached entry it finds is dropped. Files below
    /// <see cref="AlwaysKeepBelowBytes"/> stay cached either way.
    /// </summary>
    public bool KeepParsed { get; init; } = true;

    /// <summary>
    /// File size below which a parse stays cached even when <see cref="KeepParsed"/> is false: such files cost
    /// little memory, and a gate over many scripts that load the same fixtures then parses each once.
    /// </summary>
    public long AlwaysKeepBelowBytes { get; init; } = 64L << 20;

    /// <summary>Path shown in error messages (as the user wrote it); defaults to the path loaded.</summary>
    public string? DisplayPath { get; init; }

    /// <summary>
    /// When set, the file's real path (every link resolved, checked again on the opened handle) must lie inside
    /// this folder, else <c>E-PATH</c> (docs/reliability.md, "Paths").
    /// </summary>
    public string? Root { get; init; }
}
