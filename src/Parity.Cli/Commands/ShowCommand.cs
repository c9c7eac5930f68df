using System.CommandLine;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Harness.Showing;
using Parity.Script.Running;

namespace Parity.Cli.Commands;

/// <summary><c>parity show SCRIPT --checkpoint LABEL [--mode M] [--json]</c> (spec §4).</summary>
public static class ShowCommand
{
    public static Command Create(CliContext context)
    {
        var script = new Argument<string>("SCRIPT") { Description = "The .parity script to run." };
        var checkpoint = new Option<string>("--checkpoint") { Description = "The checkpoint label to show.", Required = true };
        var mode = new Option<string>("--mode") { Description = "The mode to run: legacy, modern (default) or STRINGS+MISSING+WRITES." };
        var json = new Option<bool>("--json") { Description = "Print the frame as JSON instead of a table." };
        var limits = new RunLimitOptions();
        var command = new Command("show", "Run a script in one mode and print one checkpoint's frame.") { script, checkpoint, mode, json };
        limits.AddTo(command);
        command.SetAction(parse => !limits.TryGet(parse, context, out var runOptions) ? ExitCodes.BadInput : Execute(
            context,
            runOptions,
            parse.GetValue(script) ?? "",
            parse.GetValue(checkpoint) ?? "",
            parse.GetValue(mode),
            parse.GetValue(json)));
        return command;
    }

    private static int Execute(CliContext context, RunOptions options, string scriptArg, string label, string? modeText, bool json)
    {
        var mode = Mode.Modern;
        if (modeText is not null && !Mode.TryParse(modeText, out mode))
        {
            context.Error.WriteLine("parity: error " + ErrorCodes.Usage + ": '" + modeText + "' is not a mode; valid: " + Mode.ValidSpellings);
            return ExitCodes.BadInput;
        }
        var path = Path.GetFullPath(scriptArg, context.WorkingDirectory);
        if (!File.Exists(path))
        {
            context.Error.WriteLine(scriptArg + ": error " + ErrorCodes.FileNotFound + ": no such script");
            return ExitCodes.BadInput;
        }
        var shown = Path.GetRelativePath(context.WorkingDirectory, path).Replace('\\', '/');
        var text = File.ReadAllText(path);
        var result = CheckpointShow.Run(text, shown, label, mode, Path.GetDirectoryName(path) ?? context.WorkingDirectory, options);
        foreach (var message in result.Messages)
            context.Error.WriteLine(message);
        if (result.Table is null)
            return ExitCodes.BadInput;
        if (json)
            context.Out.Write(TableJson.ToJson(result.Label, result.Mode, result.Table));
        else
            TableText.Write(result.Table, context.Out);
        return ExitCodes.Passed;
    }
}
