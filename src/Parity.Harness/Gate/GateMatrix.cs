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

    /// <summary>True when some input was bad.</summary>
    public bool HasBadInput => Problems.Count > 0;
}
