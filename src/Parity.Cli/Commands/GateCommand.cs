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
        var project = new ProjectSettings();
        var command = new Command(name, description) { scripts, modes, golden, outDir, format, tolerance, relative, rowLimit, showAccepted, maxDiffRows };
        limits.AddTo(command);
        project.AddTo(command, output: true);
        command.SetAction(p =>
        {
            // Every set-up mistake is found here, before any script runs (exit 2, one line each).
            if (!limits.TryGet(p, context, out var options)) return ExitCodes.BadInput;
            var file = project.Load(p, context);
            if (!project.TryApply(p, context, file, limits, ref options)) return ExitCodes.BadInput;
            options = GateCommandOptions.WithGolden(options, p.GetValue(golden));
            if (!GateCommandOptions.TryModes(context, p.GetValue(modes) ?? file?.Modes, ref options)
                || !GateCommandOptions.TryTwoModes(context, name, options)
                || !GateCommandOptions.TryTolerance(context, p.GetValue(tolerance), ref options)
                || !GateCommandOptions.TryRelativeTolerance(context, p.GetValue(relative), ref options)
                || !GateCommandOptions.TryRowLimit(context, p.GetValue(rowLimit), ref options)
                || !GateCommandOptions.TryTerminal(context, p.GetValue(showAccepted), p.GetValue(maxDiffRows) ?? file?.MaxDiffRows, out var terminal)
                || (compareSnapshots && !GateCommandOptions.TryGoldenExists(context, options, p.GetValue(golden) is not null || file?.Golden is not null))
                || !GateCommandOptions.TryOutput(context, p.GetValue(outDir), p.GetValue(format), file, terminal.MaxDiffRows, out var dir, out var writers)
                || !ProjectSettings.TryScripts(context, p.GetValue(scripts) ?? [], file, out var scriptList))
                return ExitCodes.BadInput;
            options = ProjectSettings.WithColumnTolerances(options, file);
            terminal = terminal with { Quiet = project.Quiet(p) };
            return Execute(context, new GateSession(options) { Progress = Progress(context) }, scriptList, compareSnapshots, dir, writers, terminal);
        });
        return command;
    }

    /// <summary>Runs the gate and prints and writes its report; returns the exit code of spec §4.</summary>
    private static int Execute(CliContext context, GateSession session, IReadOnlyList<string> scripts, bool compareSnapshots, string? dir, IReadOnlyList<IReportWriter> writers, TerminalOptions terminal)
    {
        var result = compareSnapshots ? session.Check(scripts) : session.Run(scripts);
        GateCommandOptions.WriteProblems(context, result.Problems);
        // When nothing could run, the located errors on stderr are the whole story; "passed: 0 scripts" would mislead.
        if (result.Report.Scripts.Count > 0 || !result.HasBadInput) TerminalSummary.Write(result.Report, context.Out, context.Interactive, terminal);
        ProjectSettings.WriteUnmatched(context, result.UnmatchedRules);
        if (dir is not null)
        {
            Directory.CreateDirectory(dir);
            foreach (var w in writers) w.Write(result.Report, dir);
        }
        if (result.HasBadInput) return ExitCodes.BadInput;
        return result.Failed ? ExitCodes.GateFailed : ExitCodes.Passed;
    }

    /// <summary>On an interactive terminal, one stderr line per script of a multi-script run.</summary>
    private static Action<int, int, string>? Progress(CliContext context)
    {
        if (!context.Interactive) return null;
        var gate = new object();
        return (i, n, script) =>
        {
            // Scripts may start on several threads (--jobs): one whole line at a time.
            lock (gate) context.Error.WriteLine("parity: " + i.ToString(CultureInfo.InvariantCulture) + "/" + n.ToString(CultureInfo.InvariantCulture) + " " + script);
        };
    }
}
