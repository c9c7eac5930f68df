using System.CommandLine;
using System.Globalization;
using Parity.Harness.Formatting;
using Parity.Harness.Gate;
using Parity.Harness.Project;
using Parity.Harness.Running;

namespace Parity.Cli.Commands;

/// <summary>
/// The project file (<c>--config FILE</c>, default <c>./parity.json</c> when it exists) and the options that
/// shape a gate's output: <c>--jobs</c>, <c>--quiet</c>. The file gives defaults; an
/// option on the command line overrides it (docs/workflow.md, "Project file").
/// </summary>
internal sealed class ProjectSettings
{
    private readonly Option<string> _config = new("--config")
    {
        Description = "The project file (default: parity.json in the working directory, when there is one).",
    };

    private readonly Option<int?> _jobs = new("--jobs")
    {
        Description = "Scripts run at once (default: the number of cores); the reports are the same whatever the number.",
    };

    private readonly Option<bool> _quiet = new("--quiet") { Description = "Print only the summary lines." };

    public void AddTo(Command command, bool output)
    {
        command.Options.Add(_config);
        command.Options.Add(_jobs);
        if (!output) return;
        command.Options.Add(_quiet);
    }

    public bool Quiet(ParseResult parse) => parse.GetValue(_quiet);

    /// <summary>
    /// The project file, or null when none is asked for and <c>parity.json</c> is absent. A file named by
    /// <c>--config</c> that does not exist, and any mistake in the file, throws a located E-CONFIG (exit 2).
    /// </summary>
    public ProjectFile? Load(ParseResult parse, CliContext context)
    {
        var named = parse.GetValue(_config);
        var path = Path.GetFullPath(named ?? ProjectFileReader.DefaultName, context.WorkingDirectory);
        if (named is null && !File.Exists(path)) return null;
        return ProjectFileReader.Read(path, named ?? ProjectFileReader.DefaultName);
    }

    /// <summary>
    /// Applies the project file's settings that the command line did not give, then <c>--jobs</c>; false after
    /// a usage message on stderr.
    /// </summary>
    public bool TryApply(ParseResult parse, CliContext context, ProjectFile? file, RunLimitOptions limits, ref GateOptions options)
    {
        if (file is not null)
        {
            if (file.RowLimit is { } rowLimit) options = options with { RowLimit = rowLimit };
            if (file.MaxRows is { } maxRows && !limits.GivesMaxRows(parse)) options = options with { MaxRows = maxRows };
            if (file.MaxStringBytes is { } maxBytes && !limits.GivesMaxStringBytes(parse)) options = options with { MaxStringBytes = maxBytes };
            if (file.Golden is not null) options = options with { Golden = Shown(file.Golden, context) };
            if (file.AbsoluteTolerance is { } abs) options = options with { Diff = options.Diff with { FloatTolerance = abs } };
            if (file.RelativeTolerance is { } rel) options = options with { Diff = options.Diff with { RelativeTolerance = rel } };
            options = options with { Expect = file.Expect };
        }
        var jobs = parse.GetValue(_jobs);
        if (jobs is < 1)
        {
            context.Error.WriteLine(GateMessages.Usage("--jobs must be 1 or more"));
            return false;
        }
        options = options with { Jobs = jobs ?? Environment.ProcessorCount };
        return true;
    }

    /// <summary>
    /// The project file's per-column tolerances (<c>tolerance.columns</c>): the first glob that matches a
    /// column gives its tolerance; a side it leaves out falls back to the global one (command line or file).
    /// Called after the command-line tolerances are read.
    /// </summary>
    public static GateOptions WithColumnTolerances(GateOptions options, ProjectFile? file)
    {
        if (file is null || file.ColumnTolerances.Count == 0) return options;
        var rules = file.ColumnTolerances;
        var absolute = options.Diff.FloatTolerance;
        var relative = options.Diff.RelativeTolerance;
        return options with
        {
            Diff = options.Diff with
            {
                ColumnTolerance = column =>
                {
                    foreach (var r in rules)
                        if (ExpectRule.GlobMatches(r.Glob, column)) return new Harness.Diffing.FloatTolerance(r.Absolute ?? absolute, r.Relative ?? relative);
                    return null;
                },
            },
        };
    }

    /// <summary>The scripts to run: the arguments, else the project file's <c>scripts</c>; none is a usage error.</summary>
    public static bool TryScripts(CliContext context, string[] given, ProjectFile? file, out IReadOnlyList<string> scripts)
    {
        scripts = given;
        if (given.Length > 0) return true;
        if (file?.Scripts is { } fromFile)
        {
            scripts = fromFile;
            return true;
        }
        context.Error.WriteLine(GateMessages.Usage("no scripts: give SCRIPT|DIR... or list them under \"scripts\" in " + (file?.Display ?? ProjectFileReader.DefaultName)));
        return false;
    }

    /// <summary>A full path as messages show it: relative to the working directory when inside it.</summary>
    public static string Shown(string full, CliContext context)
    {
        var relative = ScriptFiles.Relative(full, context.WorkingDirectory);
        return relative.StartsWith("..", StringComparison.Ordinal) || Path.IsPathRooted(relative) ? full : relative;
    }

    /// <summary>One line per expect rule that matched nothing (not a failure: the rule may be stale).</summary>
    public static void WriteUnmatched(CliContext context, IReadOnlyList<ExpectRule> rules)
    {
        foreach (var r in rules)
            context.Out.WriteLine("expect rule " + r.Location + " matched no finding; it may be stale" + (r.Note is null ? "" : " (" + CellText.Safe(r.Note) + ")"));
    }

    public static string Count(int n, string noun) => n.ToString(CultureInfo.InvariantCulture) + " " + noun + (n == 1 ? "" : "s");
}
