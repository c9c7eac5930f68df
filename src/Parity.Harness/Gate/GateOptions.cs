using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Golden;
using Parity.Script.Running;

namespace Parity.Harness.Gate;

/// <summary>
/// What a <see cref="GateSession"/> needs to know: where it works, which modes it compares, where the golden
/// store is, how strictly values compare and the interpreter's limits. Every property has the CLI's default.
/// </summary>
public sealed record GateOptions
{
    /// <summary>The folder that script arguments, the golden folder and the root resolve against, and
    /// that script names in findings and the golden store are relative to.</summary>
    public required string WorkingDirectory { get; init; }

    /// <summary>The modes to run and compare, in order (default <c>legacy</c>, <c>modern</c>).</summary>
    public IReadOnlyList<Mode> Modes { get; init; } = GateModes.Default;

    /// <summary>The golden store folder as the user wrote it, relative to <see cref="WorkingDirectory"/> (default <c>golden</c>).</summary>
    public string Golden { get; init; } = "golden";

    /// <summary>Frames with more rows keep a summary and hash in golden text and the data in an Arrow IPC file.</summary>
    public int RowLimit { get; init; } = GoldenStore.DefaultRowLimit;

    /// <summary>How strictly values compare, between modes and against golden frames.</summary>
    public DiffOptions Diff { get; init; } = DiffOptions.Default;

    /// <summary>Load paths may not leave this folder unless <see cref="AllowOutsideRoot"/>; null means <see cref="WorkingDirectory"/>.</summary>
    public string? Root { get; init; }

    /// <summary>Lets load paths leave <see cref="Root"/>.</summary>
    public bool AllowOutsideRoot { get; init; }

    /// <summary>Most rows a join or append may produce before a run stops with <c>E-LIMIT</c>.</summary>
    public long MaxRows { get; init; } = RunOptions.Default.MaxRows;

    /// <summary>Most UTF-8 bytes one computed string may have before a run stops with <c>E-LIMIT</c>.</summary>
    public long MaxStringBytes { get; init; } = RunOptions.Default.MaxStringBytes;

    /// <summary>Expect rules of the project file: matching findings are expected differences (docs/workflow.md).</summary>
    public IReadOnlyList<Project.ExpectRule> Expect { get; init; } = [];

    /// <summary>How many scripts run at once (default 1); reports are the same whatever the number.</summary>
    public int Jobs { get; init; } = 1;

    /// <summary>Keep every script's runs (all modes' checkpoint frames) in the results; off by default, as
    /// they hold every frame in memory until the results are dropped.</summary>
    public bool KeepRuns { get; init; }

    /// <summary>The interpreter settings these options stand for.</summary>
    internal RunOptions RunOptions => RunOptions.Default with
    {
        Root = Root ?? WorkingDirectory,
        AllowOutsideRoot = AllowOutsideRoot,
        MaxRows = MaxRows,
        MaxStringBytes = MaxStringBytes,
    };
}
