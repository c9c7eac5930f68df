using System.CommandLine;
using Parity.Harness.Gate;
using Parity.Harness.Showing;

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
        command.SetAction(parse =>
        {
            if (!limits.TryGet(parse, context, out var options)) return ExitCodes.BadInput;
            var selected = GateModes.DefaultSingle;
            if (parse.GetValue(mode) is { } modeText && !GateModes.TryParse(modeText, out selected, out var problem))
            {
                context.Error.WriteLine(GateMessages.Usage(problem));
                return ExitCodes.BadInput;
            }
            var result = new GateSession(options).Show(parse.GetValue(script) ?? "", parse.GetValue(checkpoint) ?? "", selected);
            foreach (var message in result.Messages)
                context.Error.WriteLine(message);
            if (result.Table is null)
                return ExitCodes.BadInput;
            if (parse.GetValue(json))
                context.Out.Write(TableJson.ToJson(result.Label, result.Mode, result.Table));
            else
                TableText.Write(result.Table, context.Out);
            return ExitCodes.Passed;
        });
        return command;
    }
}
