using System.Globalization;
using System.Text;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Harness.Running;
using Parity.Harness.Shrinking.Internal;
using Parity.Harness.Storage;
using Parity.Script.Diagnostics;
using Parity.Script.Parsing;
using Parity.Script.Running;
using Parity.Script.Syntax;

namespace Parity.Harness.Shrinking;

/// <summary>
/// <c>parity shrink</c>: reduces the data files a script loads to a small fixture on which one finding (same
/// key, hence same kind) still appears (docs/workflow.md, "Shrinking a finding"). Every file is read once;
/// each attempt hands the interpreter cut-down copies of those tables and runs only the finding's two modes.
/// Rows go first (delta debugging over row ranges down to single rows), then the columns the script never
/// names, then single rows again until removing any one row loses the finding.
/// </summary>
public static class Shrinker
{
    public static ShrinkResult Run(ShrinkRequest request)
    {
        if (request.Modes.Count != 2)
            throw new EngineException(ErrorCodes.Usage, "shrink compares exactly two modes: the two of the finding");
        var time = request.Time;
        var start = time.GetTimestamp();
        var shown = ScriptFiles.Relative(request.ScriptPath, request.WorkingDirectory);
        var text = ScriptSource.Read(request.ScriptPath, shown);
        var parsed = ScriptParser.Parse(text, shown);
        foreach (var d in parsed.Diagnostics)
            if (d.Severity == Severity.Error) throw new ScriptException(d);
        var scriptDir = Path.GetDirectoryName(request.ScriptPath) ?? request.WorkingDirectory;

        // The first run reads the files as any run does (so bad data is reported as usual) and records what
        // each load asked for; the finding must be there before anything is cut.
        var loads = new List<(string Full, LoadOptions Options)>();
        var first = RunModes(parsed.Script, request, scriptDir, request.RunOptions with
        {
            TableSource = (full, options, _) =>
            {
                loads.Add((full, options));
                return null;
            },
        });
        var outcome = new ScriptOutcome { Script = shown, Runs = first };
        if (outcome.IsBadInput)
            throw new EngineException(ErrorCodes.Usage, string.Join("\n", outcome.BadInputMessages));
        var findings = ModeDiffer.CompareAll(first, shown, request.Diff);
        var original = FindingKeys.Find(findings, request.FindingKey)
            ?? throw new EngineException(ErrorCodes.NoSuchFinding, NotFound(request.FindingKey, shown, request.Modes, findings));

        var sources = ReadSources(loads);
        CheckOutputs(request, sources);
        var state = new Attempts(parsed.Script, request, scriptDir, sources, start) { Last = original };
        var mentioned = ScriptNames.Mentioned(text);

        // Rows of each file: nothing at all if the finding survives that, else delta debugging.
        foreach (var s in sources)
        {
            if (state.Stopped) break;
            var r = state.Try(s, [], s.Keep, "rows");
            if (r is true) { s.Rows = []; continue; }
            if (r is null) break;
            s.Rows = DeltaDebugging.Minimize(s.Rows, rows => state.Try(s, rows, s.Keep, "rows"), out _);
        }
        // Columns no name in the script refers to: all at once, else one by one. A file keeps one column.
        foreach (var s in sources)
        {
            if (state.Stopped) break;
            var candidates = new List<int>();
            for (var c = 0; c < s.Keep.Length; c++)
                if (!mentioned.Contains(s.File.ColumnNames[c])) candidates.Add(c);
            if (candidates.Count == 0) continue;
            var all = (bool[])s.Keep.Clone();
            foreach (var c in candidates) all[c] = false;
            if (Array.IndexOf(all, true) >= 0 && state.Try(s, s.Rows, all, "columns") is true)
            {
                s.Keep = all;
                continue;
            }
            foreach (var c in candidates)
            {
                if (state.Stopped) break;
                var fewer = (bool[])s.Keep.Clone();
                fewer[c] = false;
                if (Array.IndexOf(fewer, true) < 0) continue;
                if (state.Try(s, s.Rows, fewer, "columns") is true) s.Keep = fewer;
            }
        }
        // Single rows until a whole pass removes none: 1-minimal over every file together.
        var changed = true;
        while (changed && !state.Stopped)
        {
            changed = false;
            foreach (var s in sources)
            {
                for (var i = 0; i < s.Rows.Length && !state.Stopped; i++)
                {
                    var without = new int[s.Rows.Length - 1];
                    s.Rows.AsSpan(0, i).CopyTo(without);
                    s.Rows.AsSpan(i + 1).CopyTo(without.AsSpan(i));
                    if (state.Try(s, without, s.Keep, "single rows") is true)
                    {
                        s.Rows = without;
                        changed = true;
                        i--;
                    }
                }
            }
        }

        var files = Write(request, text, parsed.Script, sources);
        // The written files are run once more from disk, as `run` would read them, unless the bound has passed
        // (the fixture may then still be large; every attempt that kept it already ran on the same tables).
        var verified = state.TimeLeft || !state.Stopped;
        var kept = verified ? Verify(request, shown, files.ScriptOut) : state.Last;
        return new ShrinkResult
        {
            ScriptOut = files.ScriptOut,
            Files = files.Files,
            Finding = kept,
            Verified = verified,
            Attempts = state.Count,
            StoppedByTimeLimit = state.Stopped,
            Elapsed = time.GetElapsedTime(start),
        };
    }

    internal static IReadOnlyList<ModeRun> RunModes(ScriptNode script, ShrinkRequest request, string scriptDir, RunOptions options)
    {
        var runs = new List<ModeRun>(2);
        foreach (var mode in request.Modes) runs.Add(Interpreter.Run(script, mode, scriptDir, options));
        return runs;
    }

    private static string NotFound(string key, string shown, IReadOnlyList<Mode> modes, IReadOnlyList<Finding> findings)
    {
        var sb = new StringBuilder();
        sb.Append(CultureInfo.InvariantCulture, $"no finding with key '{Formatting.CellText.Safe(key)}' in {Formatting.CellText.Safe(shown)} ({modes[0].Name} against {modes[1].Name})");
        if (findings.Count == 0) return sb.Append(": the script has no findings").ToString();
        sb.Append("; its keys (the \"key\" of each finding in report.json):");
        var shownCount = Math.Min(findings.Count, 20);
        for (var i = 0; i < shownCount; i++) sb.Append("\n  ").Append(Formatting.CellText.Safe(FindingKeys.Of(findings[i])));
        if (findings.Count > shownCount) sb.Append(CultureInfo.InvariantCulture, $"\n  ... and {findings.Count - shownCount} more");
        return sb.ToString();
    }

    private static List<DataSource> ReadSources(List<(string Full, LoadOptions Options)> loads)
    {
        var sources = new List<DataSource>();
        var comparison = OperatingSystem.IsWindows() ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;
        foreach (var (full, options) in loads)
        {
            var same = sources.Find(s => string.Equals(s.FullPath, full, comparison));
            if (same is not null)
            {
                if (same.Options.Delimiter != options.Delimiter || DataLoader.FormatOf(full, same.Options) != DataLoader.FormatOf(full, options))
                    throw new EngineException(ErrorCodes.Usage, $"'{Formatting.CellText.Safe(options.DisplayPath ?? full)}' is loaded twice with a different format or delimiter; shrink needs one reading of each file");
                continue;
            }
            sources.Add(new DataSource(full, options.DisplayPath ?? Path.GetFileName(full), options, ReducibleFile.Read(full, options)));
        }
        return sources;
    }

    private static void CheckOutputs(ShrinkRequest request, List<DataSource> sources)
    {
        var comparison = OperatingSystem.IsWindows() ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;
        var scriptOut = Path.Combine(request.OutDirectory, Path.GetFileName(request.ScriptPath));
        if (string.Equals(scriptOut, request.ScriptPath, comparison))
            throw new EngineException(ErrorCodes.Usage, "--out is the script's own folder: the reduced script would replace the original; choose another folder");
        foreach (var (_, path) in OutputNames(request, sources))
            foreach (var s in sources)
                if (string.Equals(path, s.FullPath, comparison))
                    throw new EngineException(ErrorCodes.Usage, $"--out would overwrite the data file '{Formatting.CellText.Safe(s.Shown)}'; choose another folder");
    }

    // data/NAME for each file; a second file of the same name gets its position in front (2-NAME).
    private static List<(string Relative, string Full)> OutputNames(ShrinkRequest request, List<DataSource> sources)
    {
        var names = new List<(string, string)>();
        var used = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        for (var i = 0; i < sources.Count; i++)
        {
            var name = Path.GetFileName(sources[i].FullPath);
            if (!used.Add(name))
            {
                name = (i + 1).ToString(CultureInfo.InvariantCulture) + "-" + name;
                used.Add(name);
            }
            var relative = "data/" + name;
            names.Add((relative, Path.Combine(request.OutDirectory, "data", name)));
        }
        return names;
    }

    private static (string ScriptOut, List<ShrunkFile> Files) Write(ShrinkRequest request, string text, ScriptNode script, List<DataSource> sources)
    {
        var names = OutputNames(request, sources);
        var files = new List<ShrunkFile>();
        for (var i = 0; i < sources.Count; i++)
        {
            var s = sources[i];
            AtomicFile.Write(names[i].Full, stream => s.File.Write(stream, s.Rows, s.Keep));
            var kept = new List<string>();
            for (var c = 0; c < s.Keep.Length; c++) if (s.Keep[c]) kept.Add(s.File.ColumnNames[c]);
            files.Add(new ShrunkFile
            {
                Source = s.Shown,
                Output = names[i].Relative,
                Format = s.File.Format,
                RowsBefore = s.File.RowCount,
                KeptRows = s.Rows,
                ColumnsBefore = s.File.ColumnNames,
                KeptColumns = kept,
            });
        }
        // The copy differs only in its load paths (same lines, so line-based keys and messages still match),
        // plus a closing comment that says where it came from.
        var scriptDir = Path.GetDirectoryName(request.ScriptPath) ?? request.WorkingDirectory;
        var edits = new List<(int Offset, int Length, string With)>();
        foreach (var statement in script.Statements)
        {
            if (statement is not LoadStatement load) continue;
            var full = Path.GetFullPath(Path.Combine(scriptDir, load.Path));
            var index = sources.FindIndex(s => string.Equals(s.FullPath, full, StringComparison.Ordinal));
            if (index < 0) continue; // a load the runs never reached keeps its path
            edits.Add((load.PathSpan.Offset, load.PathSpan.Length, "'" + names[index].Relative.Replace("'", "''", StringComparison.Ordinal) + "'"));
        }
        edits.Sort((a, b) => b.Offset.CompareTo(a.Offset));
        var sb = new StringBuilder(text);
        foreach (var (offset, length, with) in edits) sb.Remove(offset, length).Insert(offset, with);
        var body = sb.ToString();
        if (!body.TrimEnd().EndsWith('\\'))
        {
            if (body.Length > 0 && !body.EndsWith('\n')) body += "\n";
            body += "# Reduced by `parity shrink` from " + Comment(ScriptFiles.Relative(request.ScriptPath, request.WorkingDirectory))
                + " for the finding " + Comment(request.FindingKey) + "\n";
            foreach (var f in files)
                body += "# " + Comment(f.Source) + ": rows " + RowList(f.KeptRows) + " of " + f.RowsBefore.ToString(CultureInfo.InvariantCulture) + "\n";
        }
        var scriptOut = Path.Combine(request.OutDirectory, Path.GetFileName(request.ScriptPath));
        AtomicFile.WriteAllText(scriptOut, body);
        return (scriptOut, files);
    }

    /// <summary>Original row numbers (from 0) for a comment or a summary line; long lists are cut.</summary>
    public static string RowList(IReadOnlyList<int> rows)
    {
        if (rows.Count == 0) return "none";
        var sb = new StringBuilder();
        var shownCount = Math.Min(rows.Count, 20);
        for (var i = 0; i < shownCount; i++)
        {
            if (i > 0) sb.Append(", ");
            sb.Append(rows[i].ToString(CultureInfo.InvariantCulture));
        }
        if (rows.Count > shownCount) sb.Append(CultureInfo.InvariantCulture, $", ... ({rows.Count} rows)");
        return sb.ToString();
    }

    // A comment ends at the line's end: control characters (a label may hold any) become '?'.
    private static string Comment(string s)
    {
        var sb = new StringBuilder(s.Length);
        foreach (var ch in s) sb.Append(char.IsControl(ch) || ch is '\u2028' or '\u2029' or '\u0085' ? '?' : ch);
        return sb.ToString();
    }

    // Runs the written script from its files as `run` would (under the original name, so keys compare).
    private static Finding Verify(ShrinkRequest request, string shown, string scriptOut)
    {
        var parsed = ScriptParser.Parse(File.ReadAllText(scriptOut), shown);
        foreach (var d in parsed.Diagnostics)
            if (d.Severity == Severity.Error) throw new EngineException(ErrorCodes.Internal, "the reduced script does not parse: " + d.Format());
        var options = request.RunOptions with { KeepParsedSources = false, AllowOutsideRoot = true };
        var runs = RunModes(parsed.Script, request, Path.GetDirectoryName(scriptOut)!, options);
        return FindingKeys.Find(ModeDiffer.CompareAll(runs, shown, request.Diff), request.FindingKey)
            ?? throw new EngineException(ErrorCodes.Internal, "the written fixture does not show the finding; please report this with the script");
    }
}
