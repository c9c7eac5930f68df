namespace Parity.Harness.Findings;

/// <summary>How a cross-mode finding stands against the accepted set in the golden store (spec §5).</summary>
public enum FindingStatus
{
    /// <summary>Not in the accepted set: fails the gate.</summary>
    New,

    /// <summary>In the accepted set with the same count.</summary>
    Accepted,

    /// <summary>In the accepted set with another count: fails the gate.</summary>
    Changed,

    /// <summary>Accepted before, gone now: reported, does not fail.</summary>
    Resolved,

    /// <summary>Matched by an expect rule of the project file: counted and folded, never fails the gate.</summary>
    Expected,
}
