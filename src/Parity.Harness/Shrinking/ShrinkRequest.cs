using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Script.Running;

namespace Parity.Harness.Shrinking;

/// <summary>What <see cref="Shrinker"/> reduces: one finding of one script, and where the reduced fixture goes.</summary>
public sealed record ShrinkRequest
{
    /// <summary>Full path of the script.</summary>
    public required string ScriptPath { get; init; }

    /// <summary>Folder that script paths in reports (and finding keys) are relative to.</summary>
    public required string WorkingDirectory { get; init; }

    /// <summary>The finding's key as the JSON report prints it (<c>key</c>).</summary>
    public required string FindingKey { get; init; }

    /// <summary>The two modes whose comparison has the finding (the baseline first).</summary>
    public required IReadOnlyList<Mode> Modes { get; init; }

    /// <summary>Full path of the folder that receives the reduced script and its data.</summary>
    public required string OutDirectory { get; init; }

    /// <summary>The interpreter's limits and root rule.</summary>
    public RunOptions RunOptions { get; init; } = RunOptions.Default;

    public DiffOptions Diff { get; init; } = DiffOptions.Default;

    /// <summary>The time bound: no attempt starts that is expected to end after it; the best fixture so far is kept.</summary>
    public TimeSpan TimeLimit { get; init; } = TimeSpan.FromSeconds(60);

    /// <summary>The clock (tests pass their own).</summary>
    public TimeProvider Time { get; init; } = TimeProvider.System;

    /// <summary>Called after every attempt (the command line draws a progress line from it).</summary>
    public Action<ShrinkProgress>? Progress { get; init; }
}
