using System.CommandLine;
using Parity.Harness.Formatting;
using Parity.Harness.Gate;
using Parity.Harness.Running;

namespace Parity.Cli.Commands;

/// <summary><c>parity matrix SCRIPT</c>: all 8 modes; which axis flip causes each legacy-vs-modern finding (spec §4).</summary>
public static class MatrixCommand
{
    public static Command Create(CliContext context)
    {
        var script = new Argument<string>("SCRIPT") { Description = "The .parity script to run in all eight modes." };
        var tolerance = GateCommandOptions.FloatTolerance();
        var limits = new RunLimitOptions();
        var command = new Command("matrix", "Run a script in all eight modes and show which axis flip causes each finding.") { script, tolerance };
        limits.AddTo(command);
        command.SetAction(p =>
        {
            if (!limits.TryGet(p, context, out var options)
                || !GateCommandOptions.TryTolerance(context, p.GetValue(tolerance), ref options))
                return ExitCodes.BadInput;
            var result = new GateSession(options).Matrix([p.GetValue(script) ?? ""]);
            GateCommandOptions.WriteProblems(context, result.Problems);
            foreach (var s in result.Scripts)
            {
                if (result.ScriptCount > 1) context.Out.WriteLine(CellText.Safe(s.Script));
                context.Out.Write(AxisMatrix.Render(s.Rows));
            }
            return result.HasBadInput ? ExitCodes.BadInput : ExitCodes.Passed;
        });
        return command;
    }
}
