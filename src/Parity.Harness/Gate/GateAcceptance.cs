namespace Parity.Harness.Gate;

/// <summary>The result of <see cref="GateSession.Accept"/>: the scripts written and the bad-input messages.</summary>
public sealed record GateAcceptance
{
    /// <summary>The scripts accepted, in order.</summary>
    public required IReadOnlyList<AcceptedScript> Scripts { get; init; }

    /// <summary>Scripts whose stale golden folders were removed (<c>accept --prune</c>), sorted.</summary>
    public IReadOnlyList<string> Pruned { get; init; } = [];

    /// <summary>Located messages of arguments and scripts that could not be accepted.</summary>
    public required IReadOnlyList<string> Problems { get; init; }

    /// <summary>True when some input was bad.</summary>
    public bool HasBadInput => Problems.Count > 0;
}
