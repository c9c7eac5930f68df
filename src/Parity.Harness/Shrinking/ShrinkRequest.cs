using Parity.Harness.Gate;

namespace Parity.Harness.Shrinking;

/// <summary>What <see cref="Shrinker"/> reduces: one finding of one script, and where the reduced fixture goes.</summary>
public sealed record ShrinkRequest
{
    /// <summary>Full path of the script.</summary>
    public required string ScriptPath { get; init; }

    /// <summary>The finding's key as the JSON report prints it (<c>key</c>).</summary>
    public required string FindingKey { get; init; }

    /// <summary>Full path of the folder that receives the reduced script and its data.</summary>
    public required string OutDirectory { get; init; }

    /// <summary>
    /// The working directory (script names in keys are relative to it), the two modes whose comparison has the
    /// finding (the baseline first), the tolerance and the interpreter's limits and root rule.
    /// </summary>
    public required GateOptions Options { get; init; }

    /// <summary>The time bound: no attempt starts that is expected to end after it; the best fixture so far is kept.</summary>
    public TimeSpan TimeLimit { get; init; } = TimeSpan.FromSeconds(60);

    /// <summary>The clock (tests pass their own).</summary>
    public TimeProvider Time { get; init; } = TimeProvider.System;

    /// <summary>Called after every attempt (the command line draws a progress line from it).</summary>
    public Action<ShrinkProgress>? Progress { get; init; }

    internal string WorkingDirectory => Options.WorkingDirectory;

    internal IReadOnlyList<Parity.Engine.Modes.Mode> Modes => Options.Modes;

    internal Parity.Script.Running.RunOptions RunOptions => Options.RunOptions;

    internal Parity.Harness.Diffing.DiffOptions Diff => Options.Diff;
}
