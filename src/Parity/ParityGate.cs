using Parity.Harness.Findings;
using Parity.Harness.Gate;
using Parity.Harness.Reports;
using Parity.Harness.Running;

namespace Parity;

/// <summary>
/// Parity from code: run an operation script under two (or all eight) semantic modes, read its checkpoints
/// and findings, compare with the golden store, and assert it stable in a test. Each method is what the
/// <c>parity</c> command of the same name does, with the same results (the command adds only printing).
/// </summary>
/// <example>
/// <code>
/// ParityGate.AssertStable("scripts/refunds.parity", golden: "golden");
/// var result = ParityGate.Run("scripts/refunds.parity");
/// var refunds = result.Checkpoint("refunds", mode: "modern").ToDataFrame();
/// </code>
/// </example>
public static class ParityGate
{
    /// <summary>
    /// Runs the scripts at <paramref name="script"/> (a <c>.parity</c> file, or a folder for every script below
    /// it) in every mode and diffs them; findings are marked against the accepted set in the golden store, and
    /// <see cref="ParityResult.Passed"/> is what <c>parity run</c>'s exit code says.
    /// </summary>
    /// <exception cref="ParityInputException">A script or data file is bad input (located messages).</exception>
    public static ParityResult Run(string script, ParityOptions? options = null) => Gate(script, options, check: false);

    /// <summary>
    /// As <see cref="Run"/>, and every mode's checkpoints and records are compared with the golden snapshots,
    /// as <c>parity check</c> does.
    /// </summary>
    /// <exception cref="ParityInputException">A script or data file is bad input (located messages).</exception>
    public static ParityResult Check(string script, ParityOptions? options = null) => Gate(script, options, check: true);

    /// <summary>
    /// Runs a script given as text; load paths are relative to <see cref="ParityOptions.WorkingDirectory"/> and
    /// the script is named <see cref="ParityOptions.ScriptName"/>. Findings are marked against the accepted set
    /// stored for that name, if any.
    /// </summary>
    /// <exception cref="ParityInputException">The script or a data file is bad input (located messages).</exception>
    public static ParityResult RunText(string scriptText, ParityOptions? options = null)
    {
        options ??= new ParityOptions();
        var session = Session(options);
        var outcome = session.RunText(scriptText, options.ScriptName, session.Options.WorkingDirectory);
        if (outcome.IsBadInput) throw new ParityInputException(outcome.BadInputMessages);
        var report = new GateReport { Command = "run", Scripts = [session.Evaluate(outcome, compareSnapshots: false)] };
        return Result(report, [outcome]);
    }

    /// <summary>
    /// Fails unless the scripts at <paramref name="script"/> are stable: every mode equals its golden snapshot
    /// under <paramref name="golden"/> and every cross-mode finding is accepted. The exception's message is the
    /// text <c>parity check</c> prints.
    /// </summary>
    /// <param name="script">A <c>.parity</c> file, or a folder for every script below it.</param>
    /// <param name="golden">The golden store folder; overrides <see cref="ParityOptions.Golden"/>.</param>
    /// <param name="options">Modes, working directory and tolerance; null for the defaults.</param>
    /// <exception cref="ParityUnstableException">The gate fails.</exception>
    /// <exception cref="ParityInputException">A script or data file is bad input (located messages).</exception>
    public static void AssertStable(string script, string golden = "golden", ParityOptions? options = null)
    {
        var result = Check(script, (options ?? new ParityOptions()) with { Golden = golden });
        if (!result.Passed) throw new ParityUnstableException(result);
    }

    /// <summary>
    /// Writes or refreshes the golden snapshots and accepted findings of the scripts at <paramref name="script"/>,
    /// as <c>parity accept</c> does; returns the lines it prints, one per script.
    /// </summary>
    /// <exception cref="ParityInputException">A script or data file is bad input (located messages); scripts
    /// without bad input are accepted before it is thrown.</exception>
    public static IReadOnlyList<string> Accept(string script, ParityOptions? options = null)
    {
        var result = Session(options ?? new ParityOptions()).Accept([script]);
        if (result.HasBadInput) throw new ParityInputException(result.Problems);
        var lines = new List<string>(result.Scripts.Count);
        foreach (var s in result.Scripts) lines.Add(s.Describe());
        return lines;
    }

    private static ParityResult Gate(string script, ParityOptions? options, bool check)
    {
        var session = Session(options ?? new ParityOptions());
        var run = check ? session.Check([script]) : session.Run([script]);
        if (run.HasBadInput) throw new ParityInputException(run.Problems);
        return Result(run.Report, run.Outcomes);
    }

    private static GateSession Session(ParityOptions options)
    {
        var modes = string.Join(",", options.Modes);
        if (!GateModes.TryParseList(modes, out var parsed, out var problem))
            throw new ParityInputException(GateMessages.Usage("modes: " + problem));
        if (!double.IsFinite(options.FloatTolerance) || options.FloatTolerance < 0)
            throw new ParityInputException(GateMessages.Usage("float tolerance must be a number of 0 or more"));
        var gate = new GateOptions
        {
            WorkingDirectory = Path.GetFullPath(options.WorkingDirectory ?? Directory.GetCurrentDirectory()),
            Modes = parsed,
            Golden = options.Golden,
            KeepRuns = true,
        };
        return new GateSession(gate with { Diff = gate.Diff with { FloatTolerance = options.FloatTolerance } });
    }

    private static ParityResult Result(GateReport report, IReadOnlyList<ScriptOutcome> outcomes)
    {
        var text = new StringWriter { NewLine = "\n" };
        TerminalSummary.Write(report, text, colour: false);
        var scripts = new List<string>();
        var findings = new List<ParityFinding>();
        var mismatches = new List<ParityGoldenMismatch>();
        foreach (var s in report.Scripts)
        {
            scripts.Add(s.Script);
            foreach (var f in s.Findings)
                findings.Add(new ParityFinding(f.KindLabel, StatusLabel(f.Status), f.Script, f.Line, f.Checkpoint, f.Column, f.Count, f.Message, f.Hint));
            foreach (var m in s.GoldenMismatches)
                mismatches.Add(new ParityGoldenMismatch(m.Script, m.Mode, m.Checkpoint, m.Message));
        }
        var checkpoints = new List<ParityCheckpoint>();
        foreach (var o in outcomes)
            foreach (var run in o.Runs)
                foreach (var c in run.Checkpoints)
                    checkpoints.Add(new ParityCheckpoint(o.Script, c.Label, c.Line, run.Mode.Name, c.Table));
        return new ParityResult(report.Command, !report.Failed, text.ToString(), scripts, findings, mismatches, checkpoints);
    }

    private static string StatusLabel(FindingStatus status) => status.ToString().ToLowerInvariant();
}
