using System.CommandLine;

namespace Parity.Cli.Commands;

/// <summary><c>parity run SCRIPT|DIR... [--modes A,B] [--golden DIR] [--out DIR] [--format ...] [--float-tolerance X]</c> (spec §4).</summary>
public static class RunCommand
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
        var command = new Command("run", "Run scripts under two modes and diff them; fails on a finding not accepted in the golden store.")
        {
            scripts, modes, golden, outDir, format, tolerance, rowLimit,
        };
        limits.AddTo(command);
        command.SetAction(p => !limits.TryGet(p, context, out var runOptions) ? ExitCodes.BadInput : GateCommandCore.RunGate(context, "run", p.GetValue(scripts) ?? [], p.GetValue(modes), p.GetValue(golden),
            p.GetValue(outDir), p.GetValue(format), p.GetValue(tolerance), p.GetValue(rowLimit), runOptions, compareSnapshots: false));
        return command;
    }
}
