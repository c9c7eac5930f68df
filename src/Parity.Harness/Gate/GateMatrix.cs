namespace Parity.Harness.Gate;

/// <summary>The result of <see cref="GateSession.Matrix"/>: one matrix per script and the bad-input messages.</summary>
public sealed record GateMatrix
{
    /// <summary>The scripts that ran in all eight modes, in order.</summary>
    public required IReadOnlyList<MatrixScript> Scripts { get; init; }

    /// <summary>How many scripts the arguments stand for (those that ran and those with bad input).</summary>
    public int ScriptCount { get; init; }

    /// <summary>Located messages of arguments and scripts that could not run.</summary>
    public required IReadOnlyList<string> Problems { get; init; }

    /// <summary>Expect rules that matched no legacy-vs-modern finding (they may be stale).</summary>
    public IReadOnlyList<Project.ExpectRule> UnmatchedRules { get; init; } = [];

    /// <summary>True when a finding is new or changed (neither accepted nor expected).</summary>
    public bool Failed
    {
        get
        {
            foreach (var s in Scripts)
                if (s.Failed) return true;
            return false;
        }
    }

    /// <summary>True when some input was bad.</summary>
    public bool HasBadInput => Problems.Count > 0;
}
