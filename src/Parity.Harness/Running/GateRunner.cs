using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Harness.Golden;
using Parity.Script.Diagnostics;
using Parity.Script.Parsing;
using Parity.Script.Running;

namespace Parity.Harness.Running;

/// <summary>Parses and runs scripts in several modes, diffs them and weighs the result against the golden store.</summary>
public static class GateRunner
{
    /// <summary>Parses <paramref name="fullPath"/> and runs it once per mode; parse errors stop before running.</summary>
    public static ScriptOutcome RunScript(string fullPath, string workingDirectory, IReadOnlyList<Mode> modes) =>
        RunScript(fullPath, workingDirectory, modes, RunOptions.Default with { Root = workingDirectory });

    /// <summary>As above with the interpreter's limits and root rule from <paramref name="options"/>.</summary>
    public static ScriptOutcome RunScript(string fullPath, string workingDirectory, IReadOnlyList<Mode> modes, RunOptions options)
    {
        var shown = ScriptFiles.Relative(fullPath, workingDirectory);
        var text = File.ReadAllText(fullPath);
        var parsed = ScriptParser.Parse(text, shown);
        if (parsed.HasErrors)
        {
            var errors = new List<Diagnostic>();
            foreach (var d in parsed.Diagnostics)
                if (d.Severity == Severity.Error) errors.Add(d);
            return new ScriptOutcome { Script = shown, ParseErrors = errors };
        }
        var dir = Path.GetDirectoryName(fullPath) ?? workingDirectory;
        var runs = new List<ModeRun>(modes.Count);
        for (var i = 0; i < modes.Count; i++)
        {
            // The last mode needs no cached parse of the files for a mode after it.
            var last = i == modes.Count - 1;
            runs.Add(Interpreter.Run(parsed.Script, modes[i], dir, last ? options with { KeepParsedSources = false } : options));
        }
        return new ScriptOutcome { Script = shown, Runs = runs };
    }

    /// <summary>
    /// The script's result: cross-mode findings marked against the accepted set (when the store has this
    /// script), and with <paramref name="compareSnapshots"/> every mode against its golden snapshots.
    /// </summary>
    public static ScriptResult Evaluate(ScriptOutcome outcome, GoldenStore? store, bool compareSnapshots, DiffOptions diff)
    {
        var findings = ModeDiffer.CompareAll(outcome.Runs, outcome.Script, diff);
        var accepted = store?.ReadAccepted(outcome.Script);
        var marked = GoldenStore.ApplyAccepted(findings, accepted, outcome.Script);
        IReadOnlyList<GoldenMismatch> mismatches = compareSnapshots && store is not null ? store.CompareSnapshots(outcome.Script, outcome.Runs) : [];
        var modes = new List<string>(outcome.Runs.Count);
        foreach (var r in outcome.Runs) modes.Add(r.Mode.Name);
        return new ScriptResult
        {
            Script = outcome.Script,
            Modes = modes,
            Findings = marked,
            Checkpoints = CheckpointSummaries.Build(outcome.Runs),
            GoldenMismatches = mismatches,
        };
    }
}
