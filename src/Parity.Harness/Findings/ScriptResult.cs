namespace Parity.Harness.Findings;

/// <summary>Everything the reports need about one script: its findings, checkpoints and golden mismatches.</summary>
public sealed record ScriptResult
{
    /// <summary>The script path relative to the working directory, forward slashes.</summary>
    public required string Script { get; init; }

    public required IReadOnlyList<string> Modes { get; init; }

    /// <summary>Cross-mode findings, including resolved ones (which do not fail the gate).</summary>
    public required IReadOnlyList<Finding> Findings { get; init; }

    public required IReadOnlyList<CheckpointSummary> Checkpoints { get; init; }

    /// <summary>Golden mismatches; empty for <c>run</c>, which does not compare with golden files.</summary>
    public IReadOnlyList<GoldenMismatch> GoldenMismatches { get; init; } = [];

    /// <summary>True when this script fails the gate.</summary>
    public bool Failed
    {
        get
        {
            if (GoldenMismatches.Count > 0) return true;
            foreach (var f in Findings)
                if (f.Status is FindingStatus.New or FindingStatus.Changed) return true;
            return false;
        }
    }
}
