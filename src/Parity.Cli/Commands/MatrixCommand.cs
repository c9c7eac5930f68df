using System.CommandLine;
using Parity.Harness.Findings;
using Parity.Harness.Formatting;
using Parity.Harness.Gate;
using Parity.Harness.Reports;
using Parity.Harness.Running;

namespace Parity.Cli.Commands;

/// <summary>
/// <c>parity matrix SCRIPT|DIR... [--json] [--out DIR --format ...]</c>: all 8 modes; which axis flips cause
/// each legacy-vs-modern finding (spec §4). Exits 1 when a finding is neither accepted nor expected.
/// </summary>
public static class MatrixCommand
{
    public static Command Create(CliContext context)
    {
        var scripts = GateCommandOptions.Scripts();
        var json = new Option<bool>("--json") { Description = "Print the matrix as JSON (each finding with its causes)." };
        var golden = GateCommandOptions.Golden();
        var outDir = GateCommandOptions.Out();
        var format = new Option<string>("--format") { Description = "Formats for --out, comma-separated: json (matrix.json), txt (matrix.txt) (default: both)." };
        var tolerance = GateCommandOptions.FloatTolerance();
        var limits = new RunLimitOptions();
        var project = new ProjectSettings();
        var command = new Command("matrix", "Run scripts in all eight modes and show which axis flips cause each finding.") { scripts, json, golden, outDir, format, tolerance };
        limits.AddTo(command);
        project.AddTo(command, output: false);
        command.SetAction(p =>
        {
            if (!limits.TryGet(p, context, out var options)) return ExitCodes.BadInput;
            var file = project.Load(p, context);
            if (!project.TryApply(p, context, file, limits, ref options)) return ExitCodes.BadInput;
            options = GateCommandOptions.WithGolden(options, p.GetValue(golden));
            if (!GateCommandOptions.TryTolerance(context, p.GetValue(tolerance), ref options)
                || !TryFormats(context, p.GetValue(outDir), p.GetValue(format), out var dir, out var formats)
                || !ProjectSettings.TryScripts(context, p.GetValue(scripts) ?? [], file, out var scriptList))
                return ExitCodes.BadInput;
            options = ProjectSettings.WithColumnTolerances(options, file);
            var result = new GateSession(options).Matrix(scriptList);
            GateCommandOptions.WriteProblems(context, result.Problems);
            var pairs = new List<(string, IReadOnlyList<MatrixRow>)>();
            foreach (var s in result.Scripts) pairs.Add((s.Script, s.Rows));
            var text = Text(result);
            if (p.GetValue(json)) context.Out.Write(MatrixJsonWriter.Render(pairs));
            else context.Out.Write(text);
            ProjectSettings.WriteUnmatched(context, result.UnmatchedRules);
            if (dir is not null)
            {
                Directory.CreateDirectory(dir);
                if (formats.Contains("json")) Harness.Storage.AtomicFile.WriteAllText(Path.Combine(dir, MatrixJsonWriter.FileName), MatrixJsonWriter.Render(pairs));
                if (formats.Contains("txt")) Harness.Storage.AtomicFile.WriteAllText(Path.Combine(dir, "matrix.txt"), text);
            }
            if (result.HasBadInput) return ExitCodes.BadInput;
            return result.Failed ? ExitCodes.GateFailed : ExitCodes.Passed;
        });
        return command;
    }

    private static string Text(GateMatrix result)
    {
        var sb = new System.Text.StringBuilder();
        var failed = 0;
        foreach (var s in result.Scripts)
        {
            sb.Append(s.Failed ? "FAIL  " : "PASS  ").Append(CellText.Safe(s.Script)).Append('\n');
            sb.Append(AxisMatrix.Render(s.Rows));
            if (s.Failed) failed++;
            var open = 0;
            foreach (var r in s.Rows)
                if (r.Finding.Status is FindingStatus.New or FindingStatus.Changed) open++;
            if (open > 0) sb.Append(ProjectSettings.Count(open, "finding")).Append(" neither accepted nor expected\n");
        }
        sb.Append(failed > 0 ? "failed: " + failed.ToString(System.Globalization.CultureInfo.InvariantCulture) + " of " : "passed: ")
            .Append(ProjectSettings.Count(result.Scripts.Count, "script")).Append('\n');
        return sb.ToString();
    }

    private static bool TryFormats(CliContext context, string? outDir, string? formats, out string? dir, out HashSet<string> chosen)
    {
        chosen = new HashSet<string>(StringComparer.Ordinal) { "json", "txt" };
        dir = null;
        if (outDir is null)
        {
            if (formats is null) return true;
            context.Error.WriteLine(GateMessages.Usage("--format needs --out DIR"));
            return false;
        }
        dir = Path.GetFullPath(outDir, context.WorkingDirectory);
        if (File.Exists(dir))
        {
            context.Error.WriteLine(GateMessages.Usage("--out: '" + CellText.Safe(outDir) + "' is a file, not a folder; give a folder for the reports"));
            return false;
        }
        if (formats is null) return true;
        chosen.Clear();
        foreach (var part in formats.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            var name = part.ToLowerInvariant();
            if (name is not ("json" or "txt"))
            {
                context.Error.WriteLine(GateMessages.Usage("--format: unknown matrix format '" + CellText.Safe(part) + "'; valid: json, txt"));
                return false;
            }
            chosen.Add(name);
        }
        return true;
    }
}
