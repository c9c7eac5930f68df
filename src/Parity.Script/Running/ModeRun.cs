using Parity.Engine.Modes;
using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Running;

/// <summary>
/// Everything one run of a script in one mode produced: checkpoints in order, write records, warnings,
/// notes, and the error that stopped the run (null when it ran to the end).
/// </summary>
public sealed class ModeRun
{
    public ModeRun(Mode mode, string scriptFile)
    {
        Mode = mode;
        ScriptFile = scriptFile;
    }

    public Mode Mode { get; }

    public string ScriptFile { get; }

    /// <summary>The statements that were run (in every mode the same), so records can be tied to statements rather than lines.</summary>
    public IReadOnlyList<Statement> Statements { get; init; } = [];

    public List<CheckpointResult> Checkpoints { get; } = [];

    public List<WriteRecord> Writes { get; } = [];

    public List<RunWarning> Warnings { get; } = [];

    public List<RunNote> Notes { get; } = [];

    /// <summary>The run-time error that stopped this mode, or null.</summary>
    public Diagnostic? Failure { get; set; }

    public CheckpointResult? FindCheckpoint(string label)
    {
        foreach (var c in Checkpoints)
            if (string.Equals(c.Label, label, StringComparison.Ordinal)) return c;
        return null;
    }
}
