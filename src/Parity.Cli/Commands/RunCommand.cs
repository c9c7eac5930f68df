using System.CommandLine;

namespace Parity.Cli.Commands;

/// <summary><c>parity run SCRIPT|DIR... [--modes A,B] [--golden DIR] [--out DIR] [--format ...] [--float-tolerance X]</c> (spec §4).</summary>
public static class RunCommand
{
    public static Command Create(CliContext context) => GateCommand.Create(context, "run",
        "Run scripts under two modes and diff them; fails on a finding not accepted in the golden store.", compareSnapshots: false);
}
