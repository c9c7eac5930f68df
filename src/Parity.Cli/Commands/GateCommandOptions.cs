using System.CommandLine;
using System.Globalization;
using Parity.Harness.Formatting;
using Parity.Harness.Gate;
using Parity.Harness.Golden;
using Parity.Harness.Reports;

namespace Parity.Cli.Commands;

/// <summary>
/// The options <c>run</c>, <c>check</c>, <c>accept</c> and <c>matrix</c> share, and their parsing into
/// <see cref="GateOptions"/>. The work itself is <see cref="GateSession"/>'s; this class only reads the
/// command line and reports its mistakes (exit 2, before any work).
/// </summary>
internal static class GateCommandOptions
{
    public static Argument<string[]> Scripts() => new("SCRIPT|DIR") { Arity = ArgumentArity.ZeroOrMore, Description = "Scripts, folders searched for *.parity files, or globs (default: scripts of the project file)." };

    public static Option<string> Modes() => new("--modes") { Description = "Modes to compare, comma-separated: legacy, modern, all, or STRINGS+MISSING+WRITES (default legacy,modern)." };

    public static Option<string> Golden() => new("--golden") { Description = "The golden store folder (default: golden in the working directory)." };

    public static Option<string> Out() => new("--out") { Description = "Folder for the reports." };

    public static Option<string> Format() => new("--format") { Description = "Report formats for --out, comma-separated: md, json, junit, html (default: all)." };

    public static Option<string> FloatTolerance() => new("--float-tolerance") { Description = "Largest absolute difference under which two numbers count as equal (default 0: exact)." };

    public static Option<string> FloatRelativeTolerance() => new("--float-relative-tolerance") { Description = "Largest difference relative to the larger magnitude under which two numbers count as equal (default 0: exact)." };

    public static Option<bool> ShowAccepted() => new("--show-accepted") { Description = "List accepted findings one line each (default: one count line per script)." };

    public static Option<int?> MaxDiffRows() => new("--max-diff-rows") { Description = "Most rows listed per golden mismatch in the terminal, Markdown and HTML (default 20); counts are always exact." };

    public static Option<int?> RowLimit() => new("--row-limit") { Description = "Frames with more rows keep a summary and hash in text and the data in an Arrow IPC file (default 1000)." };

    /// <summary>Reads <c>--modes</c> into <paramref name="options"/>; false after a usage message on stderr.</summary>
    public static bool TryModes(CliContext context, string? text, ref GateOptions options)
    {
        if (text is null) return true;
        if (GateModes.TryParseList(text, out var modes, out var problem))
        {
            options = options with { Modes = modes };
            return true;
        }
        context.Error.WriteLine(GateMessages.Usage("--modes: " + problem));
        return false;
    }

    /// <summary>Reads <c>--float-tolerance</c> into <paramref name="options"/>; false after a usage message on stderr.</summary>
    public static bool TryTolerance(CliContext context, string? text, ref GateOptions options)
    {
        if (text is null) return true;
        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var tolerance) && double.IsFinite(tolerance) && tolerance >= 0)
        {
            options = options with { Diff = options.Diff with { FloatTolerance = tolerance } };
            return true;
        }
        context.Error.WriteLine(GateMessages.Usage("--float-tolerance: '" + CellText.Safe(text) + "' is not a number of 0 or more"));
        return false;
    }

    /// <summary>Reads <c>--float-relative-tolerance</c> into <paramref name="options"/>; false after a usage message on stderr.</summary>
    public static bool TryRelativeTolerance(CliContext context, string? text, ref GateOptions options)
    {
        if (text is null) return true;
        if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var tolerance) && double.IsFinite(tolerance) && tolerance >= 0)
        {
            options = options with { Diff = options.Diff with { RelativeTolerance = tolerance } };
            return true;
        }
        context.Error.WriteLine(GateMessages.Usage("--float-relative-tolerance: '" + CellText.Safe(text) + "' is not a number of 0 or more"));
        return false;
    }

    /// <summary>Reads <c>--show-accepted</c> and <c>--max-diff-rows</c>; false after a usage message on stderr.</summary>
    public static bool TryTerminal(CliContext context, bool showAccepted, int? maxDiffRows, out TerminalOptions terminal)
    {
        terminal = new TerminalOptions { ShowAccepted = showAccepted, MaxDiffRows = maxDiffRows ?? GoldenDiffText.DefaultMaxRows };
        if (terminal.MaxDiffRows >= 0) return true;
        context.Error.WriteLine(GateMessages.Usage("--max-diff-rows must be 0 or more"));
        return false;
    }

    /// <summary>Reads <c>--row-limit</c> into <paramref name="options"/>; false after a usage message on stderr.</summary>
    public static bool TryRowLimit(CliContext context, int? value, ref GateOptions options)
    {
        if (value is null) return true; // the default, or the project file's row_limit
        var rowLimit = value.Value;
        if (rowLimit >= 0)
        {
            options = options with { RowLimit = rowLimit };
            return true;
        }
        context.Error.WriteLine(GateMessages.Usage("--row-limit must be 0 or more"));
        return false;
    }

    /// <summary>Reads <c>--golden</c> into <paramref name="options"/>.</summary>
    public static GateOptions WithGolden(GateOptions options, string? golden) => golden is null ? options : options with { Golden = golden };

    public static bool TryWriters(CliContext context, string? outDir, string? formats, out IReadOnlyList<IReportWriter> writers) =>
        TryWriters(context, outDir, formats, GoldenDiffText.DefaultMaxRows, out writers);

    public static bool TryWriters(CliContext context, string? outDir, string? formats, int maxDiffRows, out IReadOnlyList<IReportWriter> writers)
    {
        writers = [];
        if (outDir is null)
        {
            if (formats is null) return true;
            context.Error.WriteLine(GateMessages.Usage("--format needs --out DIR"));
            return false;
        }
        try
        {
            writers = ReportWriters.Create([formats ?? string.Join(",", ReportWriters.Formats)], maxDiffRows);
            return true;
        }
        catch (ArgumentException ex)
        {
            context.Error.WriteLine(GateMessages.Usage("--format: " + ex.Message.Split(" (Parameter", StringSplitOptions.None)[0]));
            return false;
        }
    }

    /// <summary>
    /// The report writers for <c>--out</c>/<c>--format</c>, falling back to the project file's <c>out</c> and
    /// <c>formats</c>; an output folder that is an existing file is a usage error (before any work).
    /// </summary>
    public static bool TryOutput(CliContext context, string? outDir, string? formats, Harness.Project.ProjectFile? file, int maxDiffRows, out string? dir, out IReadOnlyList<IReportWriter> writers)
    {
        dir = outDir is not null ? Path.GetFullPath(outDir, context.WorkingDirectory) : file?.Out;
        var fileFormats = file?.Formats is { } f ? string.Join(",", f) : null;
        writers = [];
        if (dir is not null && File.Exists(dir))
        {
            context.Error.WriteLine(GateMessages.Usage("--out: '" + CellText.Safe(outDir ?? ProjectSettings.Shown(dir, context)) + "' is a file, not a folder; give a folder for the reports"));
            return false;
        }
        // The project file's formats matter only where there is an output folder; --format alone is a mistake.
        return dir is null ? TryWriters(context, null, formats, maxDiffRows, out writers) : TryWriters(context, dir, formats ?? fileFormats, maxDiffRows, out writers);
    }

    /// <summary>Modes of a comparison: fewer than two is a usage error (nothing to compare).</summary>
    public static bool TryTwoModes(CliContext context, string command, GateOptions options)
    {
        if (options.Modes.Count >= 2) return true;
        context.Error.WriteLine(GateMessages.Usage("--modes: " + command + " compares modes and needs at least two (e.g. --modes legacy,modern); got " + options.Modes[0].Name));
        return false;
    }

    /// <summary><c>check</c> against a golden folder named by <c>--golden</c> or the project file that does not exist is a usage error.</summary>
    public static bool TryGoldenExists(CliContext context, GateOptions options, bool named)
    {
        if (!named || Directory.Exists(Path.GetFullPath(options.Golden, context.WorkingDirectory))) return true;
        context.Error.WriteLine(GateMessages.Usage("--golden: no such folder '" + CellText.Safe(options.Golden) + "'; check compares with snapshots written by `parity accept`; give the folder that holds them"));
        return false;
    }

    /// <summary>Prints each bad-input message on stderr.</summary>
    public static void WriteProblems(CliContext context, IReadOnlyList<string> problems)
    {
        foreach (var p in problems) context.Error.WriteLine(p);
    }
}
