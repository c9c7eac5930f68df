using System.CommandLine;
using Parity.Engine.IO;
using Parity.Harness.Inspection;

namespace Parity.Cli.Commands;

/// <summary><c>parity inspect DATAFILE [--json]</c>: schema, per-mode types, missing counts, bytes per storage (spec §4).</summary>
public static class InspectCommand
{
    public static Command Create(CliContext context)
    {
        var file = new Argument<string>("DATAFILE") { Description = "A .csv, .parquet or Arrow IPC (.arrow, .arrows, .ipc, .feather) file." };
        var json = new Option<bool>("--json") { Description = "Print JSON instead of a table." };
        var command = new Command("inspect", "Show a data file's columns, their type in each mode, missing counts and bytes per string storage.")
        {
            file,
            json,
        };
        command.SetAction(parse =>
        {
            var path = parse.GetValue(file)!;
            var full = Path.Combine(context.WorkingDirectory, path);
            var inspection = DataInspector.Inspect(full, LoadOptions.Default with { DisplayPath = path });
            if (parse.GetValue(json)) InspectionJsonWriter.Write(inspection, context.Out);
            else InspectionTextWriter.Write(inspection, context.Out);
            return ExitCodes.Passed;
        });
        return command;
    }
}
