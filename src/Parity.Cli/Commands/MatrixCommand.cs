using System.CommandLine;
using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Running;

namespace Parity.Cli.Commands;

/// <summary><c>parity matrix SCRIPT</c>: all 8 modes; which axis flip causes each legacy-vs-modern finding (spec §4).</summary>
public static class MatrixCommand
{
    public static Command Create(CliContext context)
    {
        var script = new Argument<string>("SCRIPT") { Description = "The .parity script to run in all eight modes." };
        var tolerance = GateCommandCore.FloatTolerance();
        var limits = new RunLimitOptions();
        var command = new Command("matrix", "Run a script in all eight modes and show which axis flip causes each finding.") { script, tolerance };
        limits.AddTo(command);
        command.SetAction(p => !limits.TryGet(p, context, out var runOptions) ? ExitCodes.BadInput : Execute(context, runOptions, p.GetValue(script) ?? "", p.GetValue(tolerance)));
        return command;
    }

    private static int Execute(CliContext context, Script.Running.RunOptions runOptions, string script, string? toleranceText)
    {
        if (!GateCommandCore.TryTolerance(context, toleranceText, out var tolerance)) return ExitCodes.BadInput;
        var errors = new List<string>();
        var files = ScriptFiles.Resolve([script], context.WorkingDirectory, errors);
        foreach (var e in errors) context.Error.WriteLine(e);
        if (errors.Count > 0) return ExitCodes.BadInput;
        var diff = DiffOptions.Default with { FloatTolerance = tolerance };
        var bad = false;
        foreach (var file in files)
        {
            var outcome = GateRunner.RunScript(file, context.WorkingDirectory, Mode.All, runOptions);
            if (outcome.IsBadInput)
            {
                foreach (var m in outcome.BadInputMessages) context.Error.WriteLine(m);
                bad = true;
                continue;
            }
            if (files.Count > 1) context.Out.WriteLine(Harness.Formatting.CellText.Safe(outcome.Script));
            context.Out.Write(AxisMatrix.Render(AxisMatrix.Build(outcome.Runs, outcome.Script, diff)));
        }
        return bad ? ExitCodes.BadInput : ExitCodes.Passed;
    }
}
