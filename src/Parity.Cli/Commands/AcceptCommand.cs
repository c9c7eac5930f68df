using System.CommandLine;
using Parity.Harness.Formatting;
using Parity.Harness.Gate;

namespace Parity.Cli.Commands;

/// <summary><c>parity accept SCRIPT|DIR... [--golden DIR] [--checkpoint LABEL]</c>: write or refresh golden snapshots (spec §4).</summary>
public static class AcceptCommand
{
    public static Command Create(CliContext context)
    {
        var scripts = GateCommandOptions.Scripts();
        var golden = GateCommandOptions.Golden();
        var checkpoint = new Option<string>("--checkpoint") { Description = "Refresh only this checkpoint (its frames in every mode and its findings)." };
        var modes = GateCommandOptions.Modes();
        var tolerance = GateCommandOptions.FloatTolerance();
        var relative = GateCommandOptions.FloatRelativeTolerance();
        var rowLimit = GateCommandOptions.RowLimit();
        var prune = new Option<bool>("--prune") { Description = "Also remove golden folders of scripts that are gone from the folders given (stale golden)." };
        var limits = new RunLimitOptions();
        var project = new ProjectSettings();
        var command = new Command("accept", "Write or refresh the golden snapshots and accept the current cross-mode findings.")
        {
            scripts, golden, checkpoint, modes, tolerance, relative, rowLimit, prune,
        };
        limits.AddTo(command);
        project.AddTo(command, output: false);
        command.SetAction(p =>
        {
            if (!limits.TryGet(p, context, out var options)) return ExitCodes.BadInput;
            var file = project.Load(p, context);
            if (!project.TryApply(p, context, file, limits, ref options)) return ExitCodes.BadInput;
            options = GateCommandOptions.WithGolden(options, p.GetValue(golden));
            if (!GateCommandOptions.TryModes(context, p.GetValue(modes) ?? file?.Modes, ref options)
                || !GateCommandOptions.TryTolerance(context, p.GetValue(tolerance), ref options)
                || !GateCommandOptions.TryRelativeTolerance(context, p.GetValue(relative), ref options)
                || !GateCommandOptions.TryRowLimit(context, p.GetValue(rowLimit), ref options)
                || !ProjectSettings.TryScripts(context, p.GetValue(scripts) ?? [], file, out var scriptList))
                return ExitCodes.BadInput;
            options = ProjectSettings.WithColumnTolerances(options, file);
            var session = new GateSession(options);
            var result = session.Accept(scriptList, p.GetValue(checkpoint), p.GetValue(prune));
            GateCommandOptions.WriteProblems(context, result.Problems);
            foreach (var s in result.Scripts)
                context.Out.WriteLine(s.Describe());
            foreach (var s in result.Pruned)
                context.Out.WriteLine("pruned " + CellText.Safe(s) + ": no such script -> removed " + session.Store.DisplayRoot + "/" + Harness.Golden.GoldenNames.ScriptFolder(s));
            return result.HasBadInput ? ExitCodes.BadInput : ExitCodes.Passed;
        });
        return command;
    }
}
