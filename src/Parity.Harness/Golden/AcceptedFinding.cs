namespace Parity.Harness.Golden;

/// <summary>A cross-mode finding accepted into the golden store, with the count it had then.</summary>
public sealed record AcceptedFinding(string Kind, int Line, string? Checkpoint, string? Column, IReadOnlyList<string> Modes, int Count, string Message)
{
    /// <summary>The identity a current finding must match (<see cref="FindingIdentity.Of(Findings.Finding)"/>).</summary>
    public string Identity => FindingIdentity.Of(Kind, Line, Checkpoint, Column, Modes);
}
