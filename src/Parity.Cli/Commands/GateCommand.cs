using System.CommandLine;
using System.Globalization;
using Parity.Harness.Gate;
using Parity.Harness.Reports;

namespace Parity.Cli.Commands;

/// <summary><c>run</c> and <c>check</c> take the same arguments; only the golden comparison differs (spec §4).</summary>
internal static class GateCommand
{
    public static Command Create(CliContext context, string name, string description, bool compareSnapshots)
    {
        var scripts = GateCommandOptions.Scripts();
        var modes = GateCommandOptions.Modes();
        var golden = GateCommandOptions.Golden();
        var outDir = GateCommandOptions.Out();
        var format = GateCommandOptions.Format();
        var tolerance = GateCommandOptions.FloatTolerance();
        var relative = GateCommandOptions.FloatRelativeTolerance();
        var rowLimit = GateCommandOptions.RowLimit();
        var showAccepted = GateCommandOptions.ShowAccepted();
        var maxDiffRows = GateCommandOptions.MaxDiffRows();
        var limits = new RunLimitOptions();
        var command = new Command(name, description) { scripts, modes, golden, outDir, format, tolerance, relative, rowLimit, showAccepted, maxDiffRows };
        limits.AddTo(command);
        command.SetAction(p =>
        {
            if (!limits.TryGet(p, context, out var options)) return ExitCodes.BadInput;
            options = GateCommandOptions.WithGolden(options, p.GetValue(golden));
            if (!GateCommandOptions.TryModes(context, p.GetValue(modes), ref options)
                || !GateCommandOptions.TryTolerance(context, p.GetValue(tolerance), ref options)
                || !GateCommandOptions.TryRelativeTolerance(context, p.GetValue(relative), ref options)
                || !GateCommandOptions.TryRowLimit(context, p.GetValue(rowLimit), ref options)
                || !GateCommandOptions.TryTerminal(context, p.GetValue(showAccepted), p.GetValue(maxDiffRows), out var terminal)
                || !GateCommandOptions.TryWriters(context, p.GetValue(outDir), p.GetValue(format), terminal.MaxDiffRows, out var writers))
                return ExitCodes.BadInput;
            return Execute(context, new GateSession(options) { Progress = Progress(context) }, p.GetValue(scripts) ?? [], compareSnapshots, p.GetValue(outDir), writers, terminal);
        });
        return command;
    }

    /// <summary>Runs the gate and prints and writes its report; returns the exit code of spec §4.</summary>
    private static int Execute(CliContext context, GateSession session, string[] scripts, bool compareSnapshots, string? outDir, IReadOnlyList<IReportWriter> writers, TerminalOptions terminal)
    {
        var result = compareSnapshots ? session.Check(scripts) : session.Run(scripts);
        GateCommandOptions.WriteProblems(context, result.Problems);
        // When nothing could run, the located errors on stderr are the whole story; "passed: 0 scripts" would mislead.
        if (result.Report.Scripts.Count > 0 || !result.HasBadInput) TerminalSummary.Write(result.Report, context.Out, context.Interactive, terminal);
        if (outDir is not null)
        {
            var dir = Path.GetFullPath(outDir, context.WorkingDirectory);
            Directory.CreateDirectory(dir);
            foreach (var w in writers) w.Write(result.Report, dir);
        }
        if (result.HasBadInput) return ExitCodes.BadInput;
        return result.Failed ? ExitCodes.GateFailed : ExitCodes.Passed;
    }

    /// <summary>On an interactive terminal, one stderr line per script of a multi-script run.</summary>
    private static Action<int, int, string>? Progress(CliContext context) => !context.Interactive ? null : (i, n, script) =>
        context.Error.WriteLine("parity: " + i.ToString(CultureInfo.InvariantCulture) + "/" + n.ToString(CultureInfo.InvariantCulture) + " " + script);
}
