using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Harness.Golden;
using Parity.Script.Running;
using static Parity.Tests.Harness.HarnessFixtures;

namespace Parity.Tests.Harness;

public sealed class GoldenStoreTests : IDisposable
{
    private const string Script = "ferry/refunds.parity";
    private readonly string _root = Path.Combine(Path.GetTempPath(), "parity-golden-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_root)) Directory.Delete(_root, recursive: true);
    }

    private GoldenStore Store(int rowLimit = 1000) => new(_root, "golden", rowLimit);

    private static ModeRun[] Runs(double fare = 12.5)
    {
        var legacy = Run(Mode.Legacy, ("adults", Tickets(Mode.Legacy)), ("fares", Table(Mode.Legacy, ("fare", [F(fare)]))));
        var modern = Run(Mode.Modern, ("adults", Tickets(Mode.Modern)), ("fares", Table(Mode.Modern, ("fare", [F(fare)]))));
        legacy.Writes.Add(new WriteRecord(3, 1, "(tickets take 3).fare", ["tickets"]));
        modern.Writes.Add(new WriteRecord(3, 1, "(tickets take 3).fare", []));
        return [legacy, modern];
    }

    private static IReadOnlyList<Finding> Findings(IReadOnlyList<ModeRun> runs) => ModeDiffer.CompareAll(runs, Script, DiffOptions.Default);

    private static ScriptResult Result(GoldenStore store, IReadOnlyList<ModeRun> runs, bool check = true) => new()
    {
        Script = Script,
        Modes = ["legacy", "modern"],
        Findings = GoldenStore.ApplyAccepted(Findings(runs), store.ReadAccepted(Script), Script),
        Checkpoints = CheckpointSummaries.Build(runs),
        GoldenMismatches = check ? store.CompareSnapshots(Script, runs) : [],
    };

    [Fact]
    public void Accept_then_check_passes_and_accept_is_byte_identical_when_repeated()
    {
        var store = Store();
        var runs = Runs();
        store.Accept(Script, runs, Findings(runs));
        var result = Result(store, runs);
        Assert.False(result.Failed);
        Assert.Empty(result.GoldenMismatches);
        Assert.All(result.Findings, f => Assert.Equal(FindingStatus.Accepted, f.Status));
        var dir = store.ScriptFolder(Script);
        var first = Directory.EnumerateFiles(dir, "*", SearchOption.AllDirectories).Order(StringComparer.Ordinal).Select(File.ReadAllBytes).ToList();
        store.Accept(Script, runs, Findings(runs));
        var second = Directory.EnumerateFiles(dir, "*", SearchOption.AllDirectories).Order(StringComparer.Ordinal).Select(File.ReadAllBytes).ToList();
        Assert.Equal(first, second);
        Assert.True(File.Exists(Path.Combine(dir, "legacy", "adults.frame.txt")));
        Assert.True(File.Exists(Path.Combine(dir, "modern", "run.txt")));
    }

    [Fact]
    public void Missing_golden_fails_check_but_not_run()
    {
        var store = Store();
        var runs = Runs();
        var result = Result(store, runs);
        Assert.True(result.Failed);
        Assert.Equal(2, result.GoldenMismatches.Count);
        Assert.Contains("no golden snapshot", result.GoldenMismatches[0].Message, StringComparison.Ordinal);
        // Spec §4: run fails only on findings not accepted; with no store every finding is new.
        Assert.All(Result(store, runs, check: false).Findings, f => Assert.Equal(FindingStatus.New, f.Status));
    }

    [Fact]
    public void A_changed_value_is_a_golden_mismatch_with_an_excerpt()
    {
        var store = Store();
        store.Accept(Script, Runs(), Findings(Runs()));
        var result = Result(store, Runs(fare: 13.0));
        Assert.True(result.Failed);
        Assert.Equal(2, result.GoldenMismatches.Count);
        var m = result.GoldenMismatches[0];
        Assert.Equal("fares", m.Checkpoint);
        Assert.Equal("legacy", m.Mode);
        Assert.Contains("- 12.5", m.Excerpt, StringComparison.Ordinal);
        Assert.Contains("+ 13.0", m.Excerpt, StringComparison.Ordinal);
    }

    [Fact]
    public void A_new_finding_fails_and_a_changed_count_fails()
    {
        var store = Store();
        var runs = Runs();
        store.Accept(Script, runs, Findings(runs));

        var extra = Runs();
        extra[1].Warnings.Add(new RunWarning("W-CHAINED-WRITE", 3, 1, "no effect", []));
        var r1 = Result(store, extra, check: false);
        Assert.True(r1.Failed);
        Assert.Equal(FindingStatus.New, Assert.Single(r1.Findings, f => f.Kind == FindingKind.Warning).Status);

        // The same difference (NaN against null in 'age') at three rows instead of two: the count changed.
        var more = Runs();
        foreach (var run in more)
        {
            var m = Missing(run.Mode);
            run.Checkpoints[0] = run.Checkpoints[0] with
            {
                Table = Table(run.Mode, ("passenger", [S("Åsa Lindqvist"), S("Νίκος Παππάς"), S("李小龍"), S("Zoë 🚢")]), ("age", [m, m, m, I(1)]),
                    ("fare", [F(12.5), F(8.0), F(-8.0), F(4.25)]), ("note", [S("window"), m, S("refund"), S("late")])),
            };
        }
        var r2 = Result(store, more, check: false);
        var changed = Assert.Single(r2.Findings, f => f.Kind == FindingKind.Missing && f.Column == "age");
        Assert.Equal(FindingStatus.Changed, changed.Status);
        Assert.Equal(2, changed.AcceptedCount);
        Assert.True(r2.Failed);
    }

    [Fact]
    public void A_resolved_finding_is_reported_and_does_not_fail()
    {
        var store = Store();
        var runs = Runs();
        store.Accept(Script, runs, Findings(runs));
        var fixedRuns = Runs();
        fixedRuns[1].Writes[0] = fixedRuns[1].Writes[0] with { ChangedFrames = ["tickets"] };
        var result = Result(store, fixedRuns, check: false);
        var resolved = Assert.Single(result.Findings, f => f.Status == FindingStatus.Resolved);
        Assert.Equal(FindingKind.Alias, resolved.Kind);
        Assert.Equal(1, resolved.AcceptedCount);
        Assert.False(result.Failed);
    }

    [Fact]
    public void A_failure_mid_accept_leaves_the_old_store()
    {
        var store = Store();
        store.Accept(Script, Runs(), Findings(Runs()));
        var dir = store.ScriptFolder(Script);
        var before = Snapshot(dir);
        var written = 0;
        store.AfterStagedFile = _ => { if (++written == 3) throw new IOException("disk full (simulated)"); };
        Assert.Throws<IOException>(() => store.Accept(Script, Runs(fare: 99.0), Findings(Runs(fare: 99.0))));
        Assert.Equal(before, Snapshot(dir));
        store.AfterStagedFile = null;
        Assert.Empty(Result(store, Runs()).GoldenMismatches);
        // The next accept cleans up the staging folder and succeeds.
        store.Accept(Script, Runs(fare: 99.0), Findings(Runs(fare: 99.0)));
        Assert.Empty(Result(store, Runs(fare: 99.0)).GoldenMismatches);
        Assert.Single(Directory.GetDirectories(_root));
    }

    [Fact]
    public void A_kill_between_the_swap_renames_leaves_the_previous_snapshot_readable()
    {
        var store = Store();
        store.Accept(Script, Runs(), Findings(Runs()));
        store.BetweenRenames = () => throw new IOException("killed (simulated)");
        Assert.Throws<IOException>(() => store.Accept(Script, Runs(fare: 99.0), Findings(Runs(fare: 99.0))));
        Assert.False(Directory.Exists(store.ScriptFolder(Script)));
        // Readers fall back to the set-aside previous snapshot: never a mix.
        Assert.Empty(Result(store, Runs()).GoldenMismatches);
        store.BetweenRenames = null;
        store.Accept(Script, Runs(fare: 99.0), Findings(Runs(fare: 99.0)));
        Assert.Empty(Result(store, Runs(fare: 99.0)).GoldenMismatches);
        Assert.Single(Directory.GetDirectories(_root));
    }

    [Fact]
    public void A_second_accept_while_one_holds_the_lock_is_refused()
    {
        var store = Store();
        using (GoldenLock.Acquire(_root, "golden"))
        {
            var ex = Assert.Throws<EngineException>(() => store.Accept(Script, Runs(), Findings(Runs())));
            Assert.Equal(ErrorCodes.GoldenLock, ex.Code);
            Assert.StartsWith("golden/.lock: error E-GOLDEN-LOCK: ", ex.Format(), StringComparison.Ordinal);
        }
        store.Accept(Script, Runs(), Findings(Runs()));
    }

    [Fact]
    public void Accepting_one_checkpoint_keeps_the_others()
    {
        var store = Store();
        store.Accept(Script, Runs(), Findings(Runs()));
        var changed = Runs(fare: 13.0);
        store.Accept(Script, changed, Findings(changed), checkpoint: "fares");
        Assert.Empty(Result(store, changed).GoldenMismatches);
        var other = Runs(fare: 13.0);
        other[0].Checkpoints[0] = other[0].Checkpoints[0] with { Table = Table(Mode.Legacy, ("x", [I(1)])) };
        store.Accept(Script, Runs(fare: 13.0), Findings(Runs(fare: 13.0)), checkpoint: "fares");
        Assert.Single(Result(store, other).GoldenMismatches);
        var ex = Assert.Throws<EngineException>(() => store.Accept(Script, changed, Findings(changed), checkpoint: "nope"));
        Assert.Equal(ErrorCodes.Usage, ex.Code);
    }

    [Fact]
    public void Large_frames_go_to_arrow_and_a_tampered_arrow_file_is_an_error()
    {
        var store = Store(rowLimit: 2);
        var runs = Runs();
        store.Accept(Script, runs, Findings(runs));
        var arrow = Path.Combine(store.ScriptFolder(Script), "legacy", "adults.frame.arrow");
        Assert.True(File.Exists(arrow));
        Assert.Empty(Result(store, runs).GoldenMismatches);
        var other = GoldenArrow.Write("adults", Mode.Legacy, Table(Mode.Legacy, ("passenger", [S("x")])));
        File.WriteAllBytes(arrow, other);
        var ex = Assert.Throws<EngineException>(() => store.CompareSnapshots(Script, runs));
        Assert.Equal(ErrorCodes.Golden, ex.Code);
        Assert.Contains("adults.frame.arrow", ex.Format(), StringComparison.Ordinal);
    }

    [Fact]
    public void A_hand_edited_golden_file_is_a_located_error_not_a_pass()
    {
        var store = Store();
        store.Accept(Script, Runs(), Findings(Runs()));
        var path = Path.Combine(store.ScriptFolder(Script), "modern", "fares.frame.txt");
        File.WriteAllText(path, File.ReadAllText(path).Replace("12.5", "12.5.1", StringComparison.Ordinal));
        var ex = Assert.Throws<EngineException>(() => store.CompareSnapshots(Script, Runs()));
        Assert.StartsWith("golden/ferry~refunds/modern/fares.frame.txt:7:1: error E-GOLDEN", ex.Format(), StringComparison.Ordinal);
        var findings = Path.Combine(store.ScriptFolder(Script), "findings.txt");
        File.WriteAllText(findings, File.ReadAllText(findings).Replace("finding type", "finding typo", StringComparison.Ordinal));
        var ex2 = Assert.Throws<EngineException>(() => store.ReadAccepted(Script));
        Assert.Contains("findings.txt:", ex2.Format(), StringComparison.Ordinal);
    }

    [Fact]
    public void A_crlf_checkout_still_compares_equal()
    {
        var store = Store();
        store.Accept(Script, Runs(), Findings(Runs()));
        foreach (var f in Directory.EnumerateFiles(store.ScriptFolder(Script), "*.txt", SearchOption.AllDirectories))
            File.WriteAllText(f, File.ReadAllText(f).Replace("\n", "\r\n", StringComparison.Ordinal));
        Assert.Empty(Result(store, Runs()).GoldenMismatches);
    }

    private static List<string> Snapshot(string dir) =>
        Directory.EnumerateFiles(dir, "*", SearchOption.AllDirectories).Order(StringComparer.Ordinal)
            .Select(f => Path.GetRelativePath(dir, f) + "=" + Convert.ToHexString(File.ReadAllBytes(f))).ToList();
}
