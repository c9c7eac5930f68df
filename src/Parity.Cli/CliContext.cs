namespace Parity.Cli;

/// <summary>Where a command writes: injectable so tests run the CLI in-process.</summary>
public sealed record CliContext(TextWriter Out, TextWriter Error, string WorkingDirectory)
{
    /// <summary>True when output goes to a person (not redirected, not CI): progress and colour allowed.</summary>
    public bool Interactive { get; init; }
}
