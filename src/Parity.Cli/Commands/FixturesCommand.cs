using System.CommandLine;
using Parity.Harness.Fixtures;
using Parity.Harness.Gate;

namespace Parity.Cli.Commands;

/// <summary>
/// <c>parity fixtures --out DIR [--rows N] [--seed S]</c>: writes the Harbor Line demo files (spec §7),
/// from a few hundred rows for tests to millions for benchmarks. Not in spec §4: a helper for contributors.
/// </summary>
public static class FixturesCommand
{
    public static Command Create(CliContext context)
    {
        var output = new Option<string>("--out") { Description = "Directory to write tickets.csv, sailings.parquet and routes.arrow into.", Required = true };
        var rows = new Option<int>("--rows") { Description = "Number of tickets (sailings are a tenth of that).", DefaultValueFactory = _ => 300 };
        var seed = new Option<int>("--seed") { Description = "Random seed; the same seed and rows give the same files.", DefaultValueFactory = _ => 7 };
        var command = new Command("fixtures", "Write the invented Harbor Line demo data (tickets, sailings, routes).")
        {
            output,
            rows,
            seed,
        };
        command.SetAction(parse =>
        {
            var n = parse.GetValue(rows);
            if (n < 1)
            {
                context.Error.WriteLine(GateMessages.Usage("--rows must be at least 1"));
                return ExitCodes.BadInput;
            }
            var dir = Path.Combine(context.WorkingDirectory, parse.GetValue(output)!);
            var written = new HarborLineGenerator(parse.GetValue(seed)).Write(dir, n);
            foreach (var path in written)
                context.Out.Write("wrote " + Path.GetRelativePath(context.WorkingDirectory, path).Replace('\\', '/') + "\n");
            return ExitCodes.Passed;
        });
        return command;
    }
}
