using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using Parity.Harness.Gate;
using Parity.Harness.Formatting;
using Parity.Harness.Running;
using Parity.Harness.Shrinking;

namespace Parity.Cli.Commands;

/// <summary>
/// <c>parity shrink SCRIPT --finding KEY [--out DIR] [--seconds N]</c>: a minimal fixture that keeps one finding
/// (spec §4; docs/workflow.md, "Shrinking a finding").
/// </summary>
public static class ShrinkCommand
{
    public static Command Create(CliContext context)
    {
        var script = new Argument<string>("SCRIPT") { Description = "The .parity script whose finding to reduce." };
        var finding = new Option<string>("--finding") { Description = "The finding's key, as the \"key\" field of report.json prints it.", Required = true };
        var outDir = new Option<string>("--out") { Description = "Folder for the reduced script and its data (default: shrink/SCRIPT-NAME)." };
        var seconds = new Option<int?>("--seconds") { Description = "Time bound in seconds (default 60); the best fixture found so far is kept." };
        var modes = GateCommandOptions.Modes();
        var tolerance = GateCommandOptions.FloatTolerance();
        var limits = new RunLimitOptions();
        var command = new Command("shrink", "Reduce the data a script loads to a few rows on which one finding still appears.") { script, finding, outDir, seconds, modes, tolerance };
        limits.AddTo(command);
        command.SetAction(p => !limits.TryGet(p, context, out var options) ? ExitCodes.BadInput
            : Execute(context, options, p.GetValue(script) ?? "", p.GetValue(finding) ?? "", p.GetValue(outDir), p.GetValue(seconds), p.GetValue(modes), p.GetValue(tolerance)));
        return command;
    }

    private static int Execute(CliContext context, GateOptions options, string script, string key, string? outDir, int? seconds, string? modesText, string? toleranceText)
    {
        if (!GateCommandOptions.TryModes(context, modesText, ref options) || !GateCommandOptions.TryTolerance(context, toleranceText, ref options))
            return ExitCodes.BadInput;
        if (options.Modes.Count != 2)
        {
            context.Error.WriteLine(GateMessages.Usage("--modes: shrink takes the two modes of the finding"));
            return ExitCodes.BadInput;
        }
        if (seconds is < 1)
        {
            context.Error.WriteLine(GateMessages.Usage("--seconds must be 1 or more"));
            return ExitCodes.BadInput;
        }
        var errors = new List<string>();
        var files = ScriptFiles.Resolve([script], context.WorkingDirectory, errors);
        foreach (var e in errors) context.Error.WriteLine(e);
        if (errors.Count > 0) return ExitCodes.BadInput;
        if (files.Count != 1)
        {
            context.Error.WriteLine(GateMessages.Usage("shrink takes one script, not a folder"));
            return ExitCodes.BadInput;
        }
        var scriptPath = files[0];
        var outFull = Path.GetFullPath(outDir ?? Path.Combine("shrink", Path.GetFileNameWithoutExtension(scriptPath)), context.WorkingDirectory);
        var progress = new ProgressLine(context);
        var result = Shrinker.Run(new ShrinkRequest
        {
            ScriptPath = scriptPath,
            FindingKey = key,
            OutDirectory = outFull,
            Options = options,
            TimeLimit = TimeSpan.FromSeconds(seconds ?? 60),
            Progress = context.Interactive ? progress.Show : null,
        });
        progress.Clear();
        Report(context, result, seconds ?? 60);
        return ExitCodes.Passed;
    }

    private static void Report(CliContext context, ShrinkResult result, int seconds)
    {
        var o = context.Out;
        o.Write("shrink: the finding " + CellText.Safe(result.Finding.Key) + " (" + CellText.Safe(result.Finding.Message) + ") appears on:\n");
        foreach (var f in result.Files)
        {
            o.Write("  " + CellText.Safe(f.Output) + "  " + N(f.KeptRows.Count) + " of " + N(f.RowsBefore) + " rows, "
                + N(f.KeptColumns.Count) + " of " + N(f.ColumnsBefore.Count) + " columns  (from " + CellText.Safe(f.Source) + ", rows " + Shrinker.RowList(f.KeptRows) + ")\n");
        }
        o.Write("  script: " + CellText.Safe(ScriptFiles.Relative(result.ScriptOut, context.WorkingDirectory)) + "\n");
        var secs = result.Elapsed.TotalSeconds.ToString("0.0", CultureInfo.InvariantCulture);
        if (result.StoppedByTimeLimit)
            o.Write("stopped by the time bound (--seconds " + N(seconds) + ") after " + N(result.Attempts) + " attempts in " + secs + " s: the fixture keeps the finding but may not be minimal"
                + (result.Verified ? "" : " (not run again from the written files: the bound had passed)") + "; run again on the result, or with more seconds\n");
        else
            o.Write(N(result.Attempts) + " attempts in " + secs + " s; 1-minimal: removing any one remaining row loses the finding\n");
    }

    private static string N(int n) => n.ToString(CultureInfo.InvariantCulture);

    /// <summary>One status line on stderr, redrawn at most four times a second (interactive terminals only).</summary>
    private sealed class ProgressLine(CliContext context)
    {
        private readonly Stopwatch _since = Stopwatch.StartNew();
        private bool _shown;

        public void Show(ShrinkProgress p)
        {
            if (_shown && _since.ElapsedMilliseconds < 250) return;
            _since.Restart();
            _shown = true;
            context.Error.Write("\rparity shrink: " + p.Phase + ", " + p.Rows.ToString("N0", CultureInfo.InvariantCulture) + " of "
                + p.RowsBefore.ToString("N0", CultureInfo.InvariantCulture) + " rows, " + p.Attempts.ToString(CultureInfo.InvariantCulture) + " attempts, "
                + p.Elapsed.TotalSeconds.ToString("0", CultureInfo.InvariantCulture) + " s   ");
        }

        public void Clear()
        {
            if (_shown) context.Error.Write("\r" + new string(' ', 78) + "\r");
        }
    }
}
