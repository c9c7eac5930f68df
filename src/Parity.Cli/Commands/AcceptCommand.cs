using System.CommandLine;
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
        var limits = new RunLimitOptions();
        var command = new Command("accept", "Write or refresh the golden snapshots and accept the current cross-mode findings.")
        {
            scripts, golden, checkpoint, modes, tolerance, relative, rowLimit,
        };
        limits.AddTo(command);
        command.SetAction(p =>
        {
            if (!limits.TryGet(p, context, out var options)) return ExitCodes.BadInput;
            options = GateCommandOptions.WithGolden(options, p.GetValue(golden));
            if (!GateCommandOptions.TryModes(context, p.GetValue(modes), ref options)
                || !GateCommandOptions.TryTolerance(context, p.GetValue(tolerance), ref options)
                || !GateCommandOptions.TryRelativeTolerance(context, p.GetValue(relative), ref options)
                || !GateCommandOptions.TryRowLimit(context, p.GetValue(rowLimit), ref options))
                return ExitCodes.BadInput;
            var result = new GateSession(options).Accept(p.GetValue(scripts) ?? [], p.GetValue(checkpoint));
            GateCommandOptions.WriteProblems(context, result.Problems);
            foreach (var s in result.Scripts)
                context.Out.WriteLine(s.Describe());
            return result.HasBadInput ? ExitCodes.BadInput : ExitCodes.Passed;
        });
        return command;
    }
}
