using System.CommandLine;
using Parity.Cli.Commands;
using Parity.Harness.Gate;

namespace Parity.Cli;

/// <summary>
/// The <c>parity</c> command line. Each subcommand lives in <c>Commands/</c> and exposes
/// <c>Create(CliContext)</c>; this class wires them up and owns the exit-code contract: usage errors and
/// bad input exit 2 with a located message on stderr, never a stack trace.
/// </summary>
public static class CliApp
{
    public static int Run(string[] args, CliContext context)
    {
        var root = new RootCommand("Parity: run a dataframe script under two semantic modes, diff the results, gate CI on approved snapshots.");
        foreach (var command in CreateCommands(context))
            root.Subcommands.Add(command);

        var parsed = root.Parse(args);
        if (parsed.Errors.Count > 0)
        {
            foreach (var error in parsed.Errors)
                context.Error.WriteLine(GateMessages.Usage(error.Message));
            return ExitCodes.BadInput;
        }
        try
        {
            return parsed.Invoke(new InvocationConfiguration
            {
                Output = context.Out,
                Error = context.Error,
                EnableDefaultExceptionHandler = false,
            });
        }
        catch (Exception ex) when (GateMessages.TryFormat(ex, out var message))
        {
            context.Error.WriteLine(message);
            return ExitCodes.BadInput;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            context.Error.WriteLine(GateMessages.FileRead(ex.Message));
            return ExitCodes.BadInput;
        }
    }

    private static IEnumerable<Command> CreateCommands(CliContext context)
    {
        // One line per command; keep the order of spec §4.
        yield return RunCommand.Create(context);
        yield return CheckCommand.Create(context);
        yield return AcceptCommand.Create(context);
        yield return ShowCommand.Create(context);
        yield return InspectCommand.Create(context);
        yield return MatrixCommand.Create(context);
        yield return ShrinkCommand.Create(context);
        yield return FixturesCommand.Create(context);
    }
}
