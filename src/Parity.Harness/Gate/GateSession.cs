using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Harness.Golden;
using Parity.Harness.Project;
using Parity.Harness.Running;
using Parity.Harness.Showing;
using Parity.Script.Diagnostics;
using Parity.Script.Parsing;
using Parity.Script.Running;

namespace Parity.Harness.Gate;

/// <summary>
/// One gate session: scripts are run in the chosen modes, diffed, weighed against the golden store and
/// accepted into it. Every front end (the <c>parity</c> commands, the library, tests) goes through here, so
/// they give the same results for the same inputs. Script arguments are files or folders (a folder stands
/// for every <c>*.parity</c> file below it), relative to <see cref="GateOptions.WorkingDirectory"/>.
/// </summary>
public sealed class GateSession
{
    /// <summary>A session over <paramref name="options"/>; nothing is read until a method runs.</summary>
    public GateSession(GateOptions options)
    {
        Options = options;
        var root = Path.GetFullPath(options.Golden, options.WorkingDirectory);
        Store = new GoldenStore(root, options.Golden, options.RowLimit);
    }

    /// <summary>The options the session was made with.</summary>
    public GateOptions Options { get; }

    /// <summary>The golden store under <see cref="GateOptions.Golden"/>.</summary>
    public GoldenStore Store { get; }

    /// <summary>Called before each script of a multi-script run or check with (1-based position, count, script name).</summary>
    public Action<int, int, string>? Progress { get; init; }

    /// <summary><c>run</c>: every script in every mode, diffed; findings marked against the accepted set.</summary>
    public GateRun Run(IEnumerable<string> scripts) => Gate("run", scripts, compareSnapshots: false);

    /// <summary><c>check</c>: as <see cref="Run"/>, and every mode's frames and records compared with golden.</summary>
    public GateRun Check(IEnumerable<string> scripts) => Gate("check", scripts, compareSnapshots: true);

    /// <summary>
    /// <c>accept</c>: writes or refreshes each script's golden snapshot and accepted findings; with
    /// <paramref name="checkpoint"/>, only that checkpoint's frames and findings.
    /// </summary>
    public GateAcceptance Accept(IEnumerable<string> scripts, string? checkpoint = null) => Accept(scripts, checkpoint, prune: false);

    /// <summary>
    /// As <see cref="Accept(IEnumerable{string}, string?)"/>; with <paramref name="prune"/>, golden folders of
    /// scripts that are gone from the folders given are removed too (each atomically, see <see cref="GoldenStore.Prune"/>).
    /// </summary>
    public GateAcceptance Accept(IEnumerable<string> scripts, string? checkpoint, bool prune)
    {
        var problems = new List<string>();
        var arguments = new List<string>(scripts);
        var files = ScriptFiles.Resolve(arguments, Options.WorkingDirectory, problems);
        var accepted = new List<AcceptedScript>(files.Count);
        foreach (var file in files)
        {
            var outcome = RunScript(file);
            if (outcome.IsBadInput)
            {
                problems.AddRange(outcome.BadInputMessages);
                continue;
            }
            var findings = ModeDiffer.CompareAll(outcome.Runs, outcome.Script, Options.Diff);
            Store.Accept(outcome.Script, outcome.Runs, findings, checkpoint);
            var checkpoints = 0;
            foreach (var r in outcome.Runs) checkpoints = Math.Max(checkpoints, r.Checkpoints.Count);
            accepted.Add(new AcceptedScript(outcome.Script, checkpoint, checkpoints, outcome.Runs.Count, findings.Count,
                Store.DisplayRoot + "/" + GoldenNames.ScriptFolder(outcome.Script)));
        }
        var pruned = new List<string>();
        if (prune && problems.Count == 0)
        {
            foreach (var stale in Store.FindStale(FolderArguments(arguments), Relatives(files)))
            {
                Store.Prune(stale);
                pruned.Add(stale);
            }
        }
        return new GateAcceptance { Scripts = accepted, Problems = problems, Pruned = pruned };
    }

    /// <summary>
    /// <c>matrix</c>: each script in all eight modes (whatever <see cref="GateOptions.Modes"/> says); for each
    /// legacy-against-modern finding, which axis flip causes it. Nothing runs when an argument is missing.
    /// </summary>
    public GateMatrix Matrix(IEnumerable<string> scripts)
    {
        var problems = new List<string>();
        var files = ScriptFiles.Resolve(scripts, Options.WorkingDirectory, problems);
        var results = new List<MatrixScript>(files.Count);
        if (problems.Count > 0) return new GateMatrix { Scripts = results, Problems = problems };
        var rules = new ExpectRuleSet(Options.Expect);
        var outcomes = ForEachScript(files, file => RunScript(file, Mode.All));
        foreach (var outcome in outcomes)
        {
            if (outcome.IsBadInput)
            {
                problems.AddRange(outcome.BadInputMessages);
                continue;
            }
            var rows = AxisMatrix.Build(outcome.Runs, outcome.Script, Options.Diff);
            // Status against the accepted set and the expect rules, as run gives it for legacy against modern.
            var found = new List<Finding>(rows.Count);
            foreach (var r in rows) found.Add(r.Finding);
            var marked = rules.Apply(GoldenStore.ApplyAccepted(found, Store.ReadAccepted(outcome.Script), outcome.Script));
            var byKey = new Dictionary<string, Finding>(StringComparer.Ordinal);
            foreach (var f in marked)
                if (f.Status != FindingStatus.Resolved) byKey.TryAdd(f.Key, f);
            var statused = new List<MatrixRow>(rows.Count);
            foreach (var r in rows) statused.Add(r with { Finding = byKey.GetValueOrDefault(r.Finding.Key, r.Finding) });
            results.Add(new MatrixScript(outcome.Script, statused));
        }
        return new GateMatrix { Scripts = results, Problems = problems, ScriptCount = files.Count, UnmatchedRules = rules.Unmatched() };
    }

    /// <summary><c>show</c>: runs <paramref name="script"/> in <paramref name="mode"/> and picks the checkpoint labelled <paramref name="label"/>.</summary>
    public ShowResult Show(string script, string label, Mode mode)
    {
        var path = Path.GetFullPath(script, Options.WorkingDirectory);
        if (!File.Exists(path))
            return new ShowResult(label, mode.Name, null, [Engine.Text.ControlEscape.Escape(script) + ": error " + Engine.Errors.ErrorCodes.FileNotFound + ": no such script"]);
        var shown = ScriptFiles.Relative(path, Options.WorkingDirectory);
        string text;
        try
        {
            text = ScriptSource.Read(path, shown);
        }
        catch (ScriptException e)
        {
            return new ShowResult(label, mode.Name, null, [e.Diagnostic.Format()]);
        }
        return CheckpointShow.Run(text, shown, label, mode, Path.GetDirectoryName(path) ?? Options.WorkingDirectory, Options.RunOptions);
    }

    /// <summary>Parses the script at <paramref name="fullPath"/> and runs it once per mode of the options.</summary>
    public ScriptOutcome RunScript(string fullPath) => RunScript(fullPath, Options.Modes);

    /// <summary>
    /// Parses <paramref name="text"/> and runs it once per mode of the options; <paramref name="name"/> is the
    /// script's name in messages, findings and the golden store, and load paths resolve against
    /// <paramref name="directory"/>.
    /// </summary>
    public ScriptOutcome RunText(string text, string name, string directory) => RunParsed(text, name, directory, Options.Modes);

    /// <summary>
    /// A script's result: its cross-mode findings marked against the accepted set, its checkpoints and, with
    /// <paramref name="compareSnapshots"/>, every mode compared with its golden snapshot.
    /// </summary>
    public ScriptResult Evaluate(ScriptOutcome outcome, bool compareSnapshots)
    {
        var findings = ModeDiffer.CompareAll(outcome.Runs, outcome.Script, Options.Diff);
        var accepted = Store.ReadAccepted(outcome.Script);
        var marked = GoldenStore.ApplyAccepted(findings, accepted, outcome.Script);
        IReadOnlyList<GoldenMismatch> mismatches = compareSnapshots ? Store.CompareSnapshots(outcome.Script, outcome.Runs) : [];
        var modes = new List<string>(outcome.Runs.Count);
        foreach (var r in outcome.Runs) modes.Add(r.Mode.Name);
        return new ScriptResult
        {
            Script = outcome.Script,
            Modes = modes,
            Findings = marked,
            Checkpoints = CheckpointSummaries.Build(outcome.Runs),
            GoldenMismatches = mismatches,
        };
    }

    private GateRun Gate(string command, IEnumerable<string> scripts, bool compareSnapshots)
    {
        var problems = new List<string>();
        var arguments = new List<string>(scripts);
        var files = ScriptFiles.Resolve(arguments, Options.WorkingDirectory, problems);
        var rules = new ExpectRuleSet(Options.Expect);
        var started = 0;
        // Scripts run in parallel with --jobs N; each result lands in its own slot, so the report's order and
        // bytes never depend on which script finished first.
        var evaluated = ForEachScript(files, file =>
        {
            var n = Interlocked.Increment(ref started);
            if (files.Count > 1) Progress?.Invoke(n, files.Count, ScriptFiles.Relative(file, Options.WorkingDirectory));
            var outcome = RunScript(file);
            if (outcome.IsBadInput) return (outcome, (ScriptResult?)null);
            var result = Evaluate(outcome, compareSnapshots);
            result = result with { Findings = rules.Apply(result.Findings) };
            return (Options.KeepRuns ? outcome : outcome with { Runs = [] }, result);
        });
        var results = new List<ScriptResult>(files.Count);
        var outcomes = new List<ScriptOutcome>();
        foreach (var (outcome, result) in evaluated)
        {
            if (result is null)
            {
                problems.AddRange(outcome.BadInputMessages);
                continue;
            }
            results.Add(result);
            if (Options.KeepRuns) outcomes.Add(outcome);
        }
        if (compareSnapshots && problems.Count == 0)
        {
            // A folder checked whose golden store still holds a script that is gone: a stale-golden mismatch.
            foreach (var stale in Store.FindStale(FolderArguments(arguments), Relatives(files)))
                results.Add(new ScriptResult { Script = stale, Modes = [], Findings = [], Checkpoints = [], GoldenMismatches = [Store.StaleMismatch(stale)] });
        }
        return new GateRun
        {
            Report = new GateReport { Command = command, Scripts = results },
            Problems = problems,
            Outcomes = outcomes,
            UnmatchedRules = rules.Unmatched(),
        };
    }

    /// <summary>Runs <paramref name="work"/> for every file, <see cref="GateOptions.Jobs"/> at a time; results in file order.</summary>
    private List<T> ForEachScript<T>(IReadOnlyList<string> files, Func<string, T> work)
    {
        var slots = new T[files.Count];
        if (Options.Jobs <= 1 || files.Count <= 1)
        {
            for (var i = 0; i < files.Count; i++) slots[i] = work(files[i]);
        }
        else
        {
            // A failure is rethrown as itself, the first in file order, as a run with one job would throw it.
            var failures = new Exception?[files.Count];
            Parallel.For(0, files.Count, new ParallelOptions { MaxDegreeOfParallelism = Options.Jobs }, i =>
            {
                try
                {
                    slots[i] = work(files[i]);
                }
                catch (Exception e)
                {
                    failures[i] = e;
                }
            });
            foreach (var e in failures)
                if (e is not null) System.Runtime.ExceptionServices.ExceptionDispatchInfo.Throw(e);
        }
        return [.. slots];
    }

    /// <summary>The arguments that are folders, relative to the working directory with forward slashes.</summary>
    private List<string> FolderArguments(IEnumerable<string> arguments)
    {
        var folders = new List<string>();
        foreach (var a in arguments)
        {
            var full = Path.GetFullPath(a, Options.WorkingDirectory);
            if (Directory.Exists(full)) folders.Add(ScriptFiles.Relative(full, Options.WorkingDirectory));
        }
        return folders;
    }

    private List<string> Relatives(IReadOnlyList<string> files)
    {
        var list = new List<string>(files.Count);
        foreach (var f in files) list.Add(ScriptFiles.Relative(f, Options.WorkingDirectory));
        return list;
    }

    private ScriptOutcome RunScript(string fullPath, IReadOnlyList<Mode> modes)
    {
        var shown = ScriptFiles.Relative(fullPath, Options.WorkingDirectory);
        string text;
        try
        {
            // Through the file-access layer: a regular file, at most 16 MiB, strict UTF-8 (E-UTF8 located).
            text = ScriptSource.Read(fullPath, shown);
        }
        catch (ScriptException e)
        {
            return new ScriptOutcome { Script = shown, ParseErrors = [e.Diagnostic] };
        }
        return RunParsed(text, shown, Path.GetDirectoryName(fullPath) ?? Options.WorkingDirectory, modes);
    }

    private ScriptOutcome RunParsed(string text, string shown, string directory, IReadOnlyList<Mode> modes)
    {
        // Canonical order whatever --modes says, so a swapped list gives the same runs and reports (docs/workflow.md).
        modes = ModeOrder.Canonical(modes);
        var parsed = ScriptParser.Parse(text, shown);
        if (parsed.HasErrors)
        {
            var errors = new List<Diagnostic>();
            foreach (var d in parsed.Diagnostics)
                if (d.Severity == Severity.Error) errors.Add(d);
            return new ScriptOutcome { Script = shown, ParseErrors = errors };
        }
        var options = Options.RunOptions;
        var runs = new List<ModeRun>(modes.Count);
        for (var i = 0; i < modes.Count; i++)
        {
            // The last mode needs no cached parse of the files for a mode after it.
            var last = i == modes.Count - 1;
            runs.Add(Interpreter.Run(parsed.Script, modes[i], directory, last ? options with { KeepParsedSources = false } : options));
        }
        return new ScriptOutcome { Script = shown, Runs = runs };
    }
}
