using Parity.Tests.Engine.IO;
using Parity.Tests.Reliability;

namespace Parity.Tests.Harness;

/// <summary>The demo with a project file: expect rules fold the migration's known differences; parallel scripts change nothing.</summary>
public sealed class ExpectedDemoTests : IDisposable
{
    private const string Expect = """
        {
          "scripts": ["fixtures/scripts"],
          "expect": [
            // Strings move to Arrow: every object column of text becomes utf8.
            {"kind": "type", "from": "object", "to": "utf8"},
            {"kind": "missing", "from": "NaN", "to": "null"},
            {"kind": "type", "from": "timestamp", "to": "utf8", "note": "nothing does this"}
          ]
        }
        """;

    private readonly CliSandbox _box = new();

    public ExpectedDemoTests()
    {
        CliSandbox.CopyDirectory(Path.Combine(TestFiles.RepoRoot, "fixtures", "scripts"), _box.PathOf("fixtures/scripts"));
        CliSandbox.CopyDirectory(Path.Combine(TestFiles.RepoRoot, "fixtures", "harbor"), _box.PathOf("fixtures/harbor"));
    }

    public void Dispose() => _box.Dispose();

    [Fact]
    public void Expect_rules_turn_the_demo_run_into_a_short_report_of_what_is_not_expected()
    {
        // No golden store: every finding is new until accepted or expected.
        var before = _box.Cli("run", "fixtures/scripts");
        Assert.Equal(1, before.Exit);
        Assert.Contains("type object in legacy, utf8 in modern", before.Out, StringComparison.Ordinal);

        _box.Write("parity.json", Expect);
        var after = _box.Cli("run");
        Assert.Equal(1, after.Exit);
        // The expected classes are folded into a count line per script; the rest stays in full.
        Assert.DoesNotContain("type object in legacy, utf8 in modern", after.Out, StringComparison.Ordinal);
        Assert.DoesNotContain("  missing line 9  checkpoint 'after write to a view'  column 'note'", after.Out, StringComparison.Ordinal);
        Assert.Contains("  expected: ", after.Out, StringComparison.Ordinal);
        Assert.Contains("alias   line 8", after.Out, StringComparison.Ordinal);
        Assert.True(after.Out.Split('\n').Length * 3 < before.Out.Split('\n').Length * 2,
            "expected at most two thirds of the lines: " + after.Out.Split('\n').Length + " of " + before.Out.Split('\n').Length);
        // The rule that matched nothing is named by its place in the file.
        Assert.Contains("expect rule parity.json:7:5 matched no finding; it may be stale (nothing does this)", after.Out, StringComparison.Ordinal);
        Assert.DoesNotContain("expect rule parity.json:5:5", after.Out, StringComparison.Ordinal);
        Assert.Matches(@"findings: \d+ new, \d+ expected; 0 golden mismatches", after.Out);
    }

    [Fact]
    public void Expected_findings_never_fail_the_gate()
    {
        _box.Write("parity.json", """
            {"scripts": ["fixtures/scripts/refunds.parity"], "expect": [{"script": "fixtures/scripts/refunds.parity"}]}
            """);
        var run = _box.Cli("run");
        Assert.Equal(0, run.Exit);
        Assert.Matches(@"passed: 1 script; findings: \d+ expected; 0 golden mismatches", run.Out);
    }

    [Fact]
    public void Two_jobs_and_one_job_write_byte_identical_reports()
    {
        var one = _box.Cli("run", "fixtures/scripts", "--jobs", "1", "--out", "out/one");
        var two = _box.Cli("run", "fixtures/scripts", "--jobs", "2", "--out", "out/two");
        Assert.Equal(one.Exit, two.Exit);
        Assert.Equal(one.Out, two.Out);
        var a = _box.Files("out/one");
        var b = _box.Files("out/two");
        Assert.Equal(a.Keys, b.Keys);
        Assert.Equal(4, a.Count);
        foreach (var (name, bytes) in a) Assert.True(bytes.AsSpan().SequenceEqual(b[name]), name + " differs");
    }
}
