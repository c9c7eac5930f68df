using Parity.Harness.Findings;
using Parity.Harness.Running;

namespace Parity.Harness.Gate;

/// <summary>
/// The result of <see cref="GateSession.Run"/> or <see cref="GateSession.Check"/>: the report every writer
/// renders (per script: findings with their status, checkpoints, golden mismatches), and the bad-input
/// messages of scripts that could not be compared.
/// </summary>
public sealed record GateRun
{
    /// <summary>The report over the scripts that ran (scripts with bad input are not in it).</summary>
    public required GateReport Report { get; init; }

    /// <summary>Located messages, in order: missing scripts or folders, parse errors, errors in every mode.</summary>
    public required IReadOnlyList<string> Problems { get; init; }

    /// <summary>Each compared script's runs, in the order of <see cref="GateReport.Scripts"/>; empty unless
    /// <see cref="GateOptions.KeepRuns"/>.</summary>
    public IReadOnlyList<ScriptOutcome> Outcomes { get; init; } = [];

    /// <summary>Expect rules that matched no finding of this run, in file order (they may be stale).</summary>
    public IReadOnlyList<Project.ExpectRule> UnmatchedRules { get; init; } = [];

    /// <summary>True when some input was bad (<see cref="Problems"/> is not empty).</summary>
    public bool HasBadInput => Problems.Count > 0;

    /// <summary>True when a script fails the gate: a finding not accepted, or (check) a golden mismatch.</summary>
    public bool Failed => Report.Failed;
}
