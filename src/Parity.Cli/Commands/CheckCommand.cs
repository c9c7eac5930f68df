using System.CommandLine;

namespace Parity.Cli.Commands;

/// <summary><c>parity check SCRIPT|DIR... [--modes A,B] [--golden DIR] [--out DIR]</c>: the CI gate (spec §4, §5).</summary>
public static class CheckCommand
{
    public static Command Create(CliContext context) => GateCommand.Create(context, "check",
        "The CI gate: run, then compare every mode with its golden snapshots and the accepted findings.", compareSnapshots: true);
}
