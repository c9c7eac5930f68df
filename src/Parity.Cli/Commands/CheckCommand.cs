using System.CommandLine;

namespace Parity.Cli.Commands;

/// <summary><c>parity check SCRIPT|DIR... [--modes A,B] [--golden DIR] [--out DIR]</c>: the CI gate (spec §4, §5).</summary>
public static class CheckCommand
{
    public static Command Create(CliContext context)
    {
        var scripts = GateCommandCore.Scripts();
        var modes = GateCommandCore.Modes();
        var golden = GateCommandCore.Golden();
        var outDir = GateCommandCore.Out();
        var format = GateCommandCore.Format();
        var tolerance = GateCommandCore.FloatTolerance();
        var rowLimit = GateCommandCore.RowLimit();
        var limits = new RunLimitOptions();
        var command = new Command("check", "The CI gate: run, then compare every mode with its golden snapshots and the accepted findings.")
        {
            scripts, modes, golden, outDir, format, tolerance, rowLimit,
        };
        limits.AddTo(command);
        command.SetAction(p => !limits.TryGet(p, context, out var runOptions) ? ExitCodes.BadInput : GateCommandCore.RunGate(context, "check", p.GetValue(scripts) ?? [], p.GetValue(modes), p.GetValue(golden),
            p.GetValue(outDir), p.GetValue(format), p.GetValue(tolerance), p.GetValue(rowLimit), runOptions, compareSnapshots: true));
        return command;
    }
}
