using System.CommandLine;
using System.Globalization;
using Parity.Harness.Diffing;
using Parity.Harness.Formatting;
using Parity.Harness.Golden;
using Parity.Harness.Running;

namespace Parity.Cli.Commands;

/// <summary><c>parity accept SCRIPT|DIR... [--golden DIR] [--checkpoint LABEL]</c>: write or refresh golden snapshots (spec §4).</summary>
public static class AcceptCommand
{
    public static Command Create(CliContext context)
    {
        var scripts = GateCommandCore.Scripts();
        var golden = GateCommandCore.Golden();
        var checkpoint = new Option<string>("--checkpoint") { Description = "Refresh only this checkpoint (its frames in every mode and its findings)." };
        var modes = GateCommandCore.Modes();
        var tolerance = GateCommandCore.FloatTolerance();
        var rowLimit = GateCommandCore.RowLimit();
        var limits = new RunLimitOptions();
        var command = new Command("accept", "Write or refresh the golden snapshots and accept the current cross-mode findings.")
        {
            scripts, golden, checkpoint, modes, tolerance, rowLimit,
        };
        limits.AddTo(command);
        command.SetAction(p => !limits.TryGet(p, context, out var runOptions) ? ExitCodes.BadInput : Execute(context, runOptions, p.GetValue(scripts) ?? [], p.GetValue(golden), p.GetValue(checkpoint), p.GetValue(modes), p.GetValue(tolerance), p.GetValue(rowLimit)));
        return command;
    }

    private static int Execute(CliContext context, Script.Running.RunOptions runOptions, string[] scripts, string? golden, string? checkpoint, string? modesText, string? toleranceText, int? rowLimitValue)
    {
        if (!GateCommandCore.TryModes(context, modesText, out var modes)
            || !GateCommandCore.TryTolerance(context, toleranceText, out var tolerance)
            || !GateCommandCore.TryRowLimit(context, rowLimitValue, out var rowLimit))
            return ExitCodes.BadInput;
        var errors = new List<string>();
        var files = ScriptFiles.Resolve(scripts, context.WorkingDirectory, errors);
        foreach (var e in errors) context.Error.WriteLine(e);
        var badInput = errors.Count > 0;
        var store = GateCommandCore.Store(context, golden, rowLimit);
        var diff = DiffOptions.Default with { FloatTolerance = tolerance };
        foreach (var file in files)
        {
            var outcome = GateRunner.RunScript(file, context.WorkingDirectory, modes, runOptions);
            if (outcome.IsBadInput)
            {
                foreach (var m in outcome.BadInputMessages) context.Error.WriteLine(m);
                badInput = true;
                continue;
            }
            var findings = ModeDiffer.CompareAll(outcome.Runs, outcome.Script, diff);
            store.Accept(outcome.Script, outcome.Runs, findings, checkpoint);
            var checkpoints = 0;
            foreach (var r in outcome.Runs) checkpoints = Math.Max(checkpoints, r.Checkpoints.Count);
            context.Out.WriteLine("accepted " + CellText.Safe(outcome.Script)
                + (checkpoint is null ? "" : " checkpoint " + CellText.Quote(checkpoint))
                + ": " + Count(checkpoints, "checkpoint") + " in " + Count(outcome.Runs.Count, "mode") + ", " + Count(findings.Count, "finding")
                + " -> " + store.DisplayRoot + "/" + GoldenNames.ScriptFolder(outcome.Script));
        }
        return badInput ? ExitCodes.BadInput : ExitCodes.Passed;
    }

    private static string Count(int n, string noun) => n.ToString(CultureInfo.InvariantCulture) + " " + noun + (n == 1 ? "" : "s");
}
