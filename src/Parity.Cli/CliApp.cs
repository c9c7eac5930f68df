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
        if (UsageMistake(root, parsed, context.WorkingDirectory) is { } mistake)
        {
            context.Error.WriteLine(GateMessages.Usage(mistake));
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

    /// <summary>
    /// The first mistake of the command line as one line, with a suggestion where a name is near: an unknown
    /// command (<c>chek</c>: did you mean <c>check</c>?), an unknown option (<c>--fromat</c>: did you mean
    /// <c>--format</c>?) even where the parser took it for a script path, or the parser's own first error.
    /// </summary>
    private static string? UsageMistake(RootCommand root, ParseResult parsed, string workingDirectory)
    {
        var command = parsed.CommandResult.Command;
        if (ReferenceEquals(command, root))
        {
            if (parsed.Tokens.Count == 0) return "no command given; commands: " + Names(root.Subcommands);
            var first = parsed.Tokens[0].Value;
            if (!first.StartsWith('-'))
                return "unknown command '" + Harness.Formatting.CellText.Safe(first) + "'" + Script.Diagnostics.NameSuggester.DidYouMean(first, SubcommandNames(root)) + "; commands: " + Names(root.Subcommands);
        }
        // Unknown option-like words: the parser's unmatched tokens, and words it gave a script argument.
        var suspects = new List<string>();
        foreach (var t in parsed.UnmatchedTokens) suspects.Add(t);
        foreach (var child in parsed.CommandResult.Children)
        {
            if (child is not System.CommandLine.Parsing.ArgumentResult arg) continue;
            foreach (var t in arg.Tokens)
                if (t.Value.Length > 1 && t.Value[0] == '-' && !double.TryParse(t.Value, System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out _)
                    && !File.Exists(Path.Combine(workingDirectory, t.Value)) && !Directory.Exists(Path.Combine(workingDirectory, t.Value)))
                    suspects.Add(t.Value);
        }
        foreach (var word in suspects)
        {
            if (!word.StartsWith('-')) continue;
            var options = new List<string>();
            foreach (var o in command.Options)
            {
                if (o.Hidden) continue;
                options.Add(o.Name);
                foreach (var alias in o.Aliases) options.Add(alias);
            }
            return "unknown option '" + Harness.Formatting.CellText.Safe(word) + "' for " + command.Name + Script.Diagnostics.NameSuggester.DidYouMean(word, options)
                + "; see `parity " + command.Name + " --help`";
        }
        if (parsed.Errors.Count > 0) return parsed.Errors[0].Message;
        return null;
    }

    private static List<string> SubcommandNames(Command root)
    {
        var names = new List<string>();
        foreach (var c in root.Subcommands) names.Add(c.Name);
        return names;
    }

    private static string Names(IEnumerable<Command> commands) => string.Join(", ", commands.Select(c => c.Name));

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
