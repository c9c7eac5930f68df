using System.CommandLine;
using Parity.Harness.Gate;
using Parity.Harness.Inspection;

namespace Parity.Cli.Commands;

/// <summary>
/// <c>parity inspect DATAFILE [--json]</c>: schema, per-mode types, missing counts, bytes per storage (spec §4).
/// Beyond the spec, <c>--delimiter</c> and <c>--missing</c> give a CSV file the same options a script's
/// <c>load ... with (...)</c> can, so a semicolon file can be inspected as it will be loaded.
/// </summary>
public static class InspectCommand
{
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("DATAFILE") { Description = "A .csv, .parquet or Arrow IPC (.arrow, .arrows, .ipc, .feather) file." };
        var json = new Option<bool>("--json") { Description = "Print JSON instead of a table." };
        var delimiter = new Option<string?>("--delimiter") { Description = "CSV field separator (one character; default ',')." };
        var missing = new Option<string[]>("--missing") { Description = "A CSV field value that means missing; repeat for several (default: only the empty field).", AllowMultipleArgumentsPerToken = false };
        var command = new Command("inspect", "Show a data file's columns, their type in each mode, missing counts and bytes per string storage.")
        {
            file,
            json,
            delimiter,
            missing,
        };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            char? separator = null;
            if (parse.GetValue(delimiter) is { } d)
            {
                if (d.Length != 1)
                {
                    context.Error.WriteLine(GateMessages.Usage("--delimiter must be one character, e.g. --delimiter ';'"));
                    return ExitCodes.BadInput;
                }
                separator = d[0];
            }
            var full = Path.Combine(context.WorkingDirectory, path);
            var inspection = DataInspector.Inspect(full, path, separator, parse.GetValue(missing));
            if (parse.GetValue(json)) InspectionJsonWriter.Write(inspection, context.Out);
            else InspectionTextWriter.Write(inspection, context.Out);
            return ExitCodes.Passed;
        });
        return command;
    }
}
