using System.CommandLine;
using System.Globalization;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Harness.Golden;
using Parity.Harness.Reports;
using Parity.Harness.Running;

namespace Parity.Cli.Commands;

/// <summary>What <c>run</c>, <c>check</c>, <c>accept</c> and <c>matrix</c> share: options, script resolution, the gate loop.</summary>
internal static class GateCommandCore
{
    public static Argument<string[]> Scripts() => new("SCRIPT|DIR") { Arity = ArgumentArity.OneOrMore, Description = "Scripts, or folders searched for *.parity files." };

    public static Option<string> Modes() => new("--modes") { Description = "Modes to compare, comma-separated: legacy, modern, all, or STRINGS+MISSING+WRITES (default legacy,modern)." };

    public static Option<string> Golden() => new("--golden") { Description = "The golden store folder (default: golden in the working directory)." };

    public static Option<string> Out() => new("--out") { Description = "Folder for the reports." };

    public static Option<string> Format() => new("--format") { Description = "Report formats for --out, comma-separated: md, json, junit, html (default: all)." };

    public static Option<string> FloatTolerance() => new("--float-tolerance") { Description = "Largest absolute difference under which two numbers count as equal (default 0: exact)." };

    public static Option<int?> RowLimit() => new("--row-limit") { Description = "Frames with more rows keep a summary and hash in text and the data in an Arrow IPC file (default 1000)." };

    public static bool TryModes(CliContext context, string? text, out IReadOnlyList<Mode> modes)
    {
        if (text is null)
        {
            modes = [Mode.Legacy, Mode.Modern];
            return true;
        }
        if (Mode.TryParseList(text, out var parsed, out var bad))
        {
            modes = parsed;
            return true;
        }
        context.Error.WriteLine("parity: error " + ErrorCodes.Usage + ": --modes: '" + Harness.Formatting.CellText.Safe(bad ?? "") + "' is not a mode; valid: all, " + Mode.ValidSpellings);
        modes = [];
        return false;
    }

    public static bool TryTolerance(CliContext context, string? text, out double tolerance)
    {
        tolerance = 0;
        if (text is null) return true;
        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out tolerance) && double.IsFinite(tolerance) && tolerance >= 0) return true;
        context.Error.WriteLine("parity: error " + ErrorCodes.Usage + ": --float-tolerance: '" + Harness.Formatting.CellText.Safe(text) + "' is not a number of 0 or more");
        return false;
    }

    public static bool TryRowLimit(CliContext context, int? value, out int rowLimit)
    {
        rowLimit = value ?? GoldenStore.DefaultRowLimit;
        if (rowLimit >= 0) return true;
        context.Error.WriteLine("parity: error " + ErrorCodes.Usage + ": --row-limit must be 0 or more");
        return false;
    }

    public static GoldenStore Store(CliContext context, string? golden, int rowLimit)
    {
        var display = golden ?? "golden";
        return new GoldenStore(Path.GetFullPath(display, context.WorkingDirectory), display, rowLimit);
    }

    public static bool TryWriters(CliContext context, string? outDir, string? formats, out IReadOnlyList<IReportWriter> writers)
    {
        writers = [];
        if (outDir is null)
        {
            if (formats is null) return true;
            context.Error.WriteLine("parity: error " + ErrorCodes.Usage + ": --format needs --out DIR");
            return false;
        }
        try
        {
            writers = ReportWriters.Create([formats ?? string.Join(",", ReportWriters.Formats)]);
            return true;
        }
        catch (ArgumentException ex)
        {
            context.Error.WriteLine("parity: error " + ErrorCodes.Usage + ": --format: " + ex.Message.Split(" (Parameter", StringSplitOptions.None)[0]);
            return false;
        }
    }

    /// <summary><c>run</c> and <c>check</c> take the same arguments; only the golden comparison differs.</summary>
    public static Command CreateGate(CliContext context, string name, string description, bool compareSnapshots)
    {
        var scripts = Scripts();
        var modes = Modes();
        var golden = Golden();
        var outDir = Out();
        var format = Format();
        var tolerance = FloatTolerance();
        var rowLimit = RowLimit();
        var limits = new RunLimitOptions();
        var command = new Command(name, description) { scripts, modes, golden, outDir, format, tolerance, rowLimit };
        limits.AddTo(command);
        command.SetAction(p => !limits.TryGet(p, context, out var runOptions) ? ExitCodes.BadInput : RunGate(context, name, p.GetValue(scripts) ?? [], p.GetValue(modes), p.GetValue(golden),
            p.GetValue(outDir), p.GetValue(format), p.GetValue(tolerance), p.GetValue(rowLimit), runOptions, compareSnapshots));
        return command;
    }

    /// <summary>The loop of <c>run</c> and <c>check</c>: returns the exit code of spec §4.</summary>
    public static int RunGate(CliContext context, string command, string[] scripts, string? modesText, string? golden, string? outDir, string? formats,
        string? toleranceText, int? rowLimitValue, Script.Running.RunOptions runOptions, bool compareSnapshots)
    {
        if (!TryModes(context, modesText, out var modes)
            || !TryTolerance(context, toleranceText, out var tolerance)
            || !TryRowLimit(context, rowLimitValue, out var rowLimit)
            || !TryWriters(context, outDir, formats, out var writers))
            return ExitCodes.BadInput;
        var errors = new List<string>();
        var files = ScriptFiles.Resolve(scripts, context.WorkingDirectory, errors);
        foreach (var e in errors) context.Error.WriteLine(e);
        var badInput = errors.Count > 0;
        var store = Store(context, golden, rowLimit);
        var diff = DiffOptions.Default with { FloatTolerance = tolerance };
        var results = new List<ScriptResult>();
        for (var i = 0; i < files.Count; i++)
        {
            if (context.Interactive && files.Count > 1)
                context.Error.WriteLine("parity: " + (i + 1).ToString(CultureInfo.InvariantCulture) + "/" + files.Count.ToString(CultureInfo.InvariantCulture) + " " + ScriptFiles.Relative(files[i], context.WorkingDirectory));
            var outcome = GateRunner.RunScript(files[i], context.WorkingDirectory, modes, runOptions);
            if (outcome.IsBadInput)
            {
                foreach (var m in outcome.BadInputMessages) context.Error.WriteLine(m);
                badInput = true;
                continue;
            }
            results.Add(GateRunner.Evaluate(outcome, store, compareSnapshots, diff));
        }
        var report = new GateReport { Command = command, Scripts = results };
        // When nothing could run, the located errors on stderr are the whole story; "passed: 0 scripts" would mislead.
        if (results.Count > 0 || !badInput) TerminalSummary.Write(report, context.Out, context.Interactive);
        if (outDir is not null)
        {
            var dir = Path.GetFullPath(outDir, context.WorkingDirectory);
            Directory.CreateDirectory(dir);
            foreach (var w in writers) w.Write(report, dir);
        }
        if (badInput) return ExitCodes.BadInput;
        return report.Failed ? ExitCodes.GateFailed : ExitCodes.Passed;
    }
}
