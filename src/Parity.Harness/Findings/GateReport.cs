namespace Parity.Harness.Findings;

/// <summary>The outcome of one <c>run</c> or <c>check</c> over one or more scripts: what every report renders.</summary>
public sealed record GateReport
{
    /// <summary>Version of the JSON report format.</summary>
    public const int FormatVersion = 2;

    /// <summary><c>run</c> or <c>check</c>.</summary>
    public required string Command { get; init; }

    public required IReadOnlyList<ScriptResult> Scripts { get; init; }

    /// <summary>The one explicit timestamp field of the reports (ISO 8601, UTC); null keeps reports byte-identical.</summary>
    public string? GeneratedAt { get; init; }

    public bool Failed
    {
        get
        {
            foreach (var s in Scripts)
                if (s.Failed) return true;
            return false;
        }
    }
}
