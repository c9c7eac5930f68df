using System.Text.Json;
using Parity.Cli;
using Parity.Tests.Engine.IO;

namespace Parity.Tests.Library;

/// <summary>The library API gives what the CLI gives: the same findings, statuses, checkpoints and text.</summary>
public sealed class ParityGateTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-lib-" + Guid.NewGuid().ToString("N"));

    public ParityGateTests()
    {
        Directory.CreateDirectory(Path.Combine(_dir, "scripts"));
        File.WriteAllText(Path.Combine(_dir, "scripts", "tickets.csv"), "id,passenger,age,fare,note\n1,Åsa,34,12.5,window\n2,Νίκος,,8.0,\n3,李小龍,71,-8.0,refund\n4,Zoë 🚢,17,4.25,\n");
        File.WriteAllText(Path.Combine(_dir, "scripts", "refunds.parity"),
            "load tickets from 'tickets.csv'\nlet refunds = tickets where fare < 0\ncheck refunds\nlet adults = tickets where age >= 18\ncheck adults\n");
    }

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    private static (int Exit, string Out, string Err) Cli(string dir, params string[] args)
    {
        var o = new StringWriter { NewLine = "\n" };
        var e = new StringWriter { NewLine = "\n" };
        var exit = CliApp.Run(args, new CliContext(o, e, dir));
        return (exit, o.ToString(), e.ToString());
    }

    [Fact]
    public void The_demo_is_stable()
    {
        ParityGate.AssertStable("fixtures/scripts", golden: "golden", new ParityOptions { WorkingDirectory = TestFiles.RepoRoot });
    }

    [Fact]
    public void The_cli_reports_equal_the_library_results_for_the_demo()
    {
        var options = new ParityOptions { WorkingDirectory = TestFiles.RepoRoot };
        var library = ParityGate.Check("fixtures/scripts", options);
        var outDir = Path.Combine(_dir, "reports");
        var (exit, output, err) = Cli(TestFiles.RepoRoot, "check", "fixtures/scripts", "--out", outDir, "--format", "json");
        Assert.Equal("", err);
        Assert.Equal(0, exit);
        Assert.True(library.Passed);
        Assert.Equal(output, library.Text);                        // the terminal summary, word for word

        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "report.json")));
        var findings = new List<ParityFinding>();
        var scripts = new List<string>();
        var checkpoints = 0;
        foreach (var s in json.RootElement.GetProperty("scripts").EnumerateArray())
        {
            scripts.Add(s.GetProperty("script").GetString()!);
            foreach (var c in s.GetProperty("checkpoints").EnumerateArray())
                checkpoints += c.GetProperty("modes").EnumerateObject().Count();
            foreach (var f in s.GetProperty("findings").EnumerateArray())
            {
                findings.Add(new ParityFinding(f.GetProperty("kind").GetString()!, f.GetProperty("status").GetString()!, f.GetProperty("script").GetString()!,
                    f.GetProperty("line").GetInt32(), f.GetProperty("checkpoint").GetString(), f.GetProperty("column").GetString(),
                    f.GetProperty("count").GetInt32(), f.GetProperty("message").GetString()!, f.GetProperty("hint").GetString()!));
            }
        }
        Assert.Equal(scripts, library.Scripts);
        Assert.Equal(findings, library.Findings);
        Assert.NotEmpty(findings);
        Assert.Equal(checkpoints, library.Checkpoints.Count);
        Assert.Empty(library.GoldenMismatches);
    }

    [Fact]
    public void An_unstable_script_throws_the_text_the_cli_prints()
    {
        var options = new ParityOptions { WorkingDirectory = _dir };
        var ex = Assert.Throws<ParityUnstableException>(() => ParityGate.AssertStable("scripts/refunds.parity", golden: "golden", options));
        // The default folder: naming a golden folder that does not exist is a set-up mistake for the CLI (exit 2).
        var (exit, output, _) = Cli(_dir, "check", "scripts/refunds.parity");
        Assert.Equal(1, exit);
        Assert.Equal(output, ex.Message);
        Assert.Contains("FAIL  scripts/refunds.parity", ex.Message, StringComparison.Ordinal);
        Assert.Contains(ex.Result!.GoldenMismatches, m => m.Script == "scripts/refunds.parity");

        var lines = ParityGate.Accept("scripts/refunds.parity", options);
        Assert.Equal(Cli(_dir, "accept", "scripts/refunds.parity").Out, string.Concat(lines.Select(l => l + "\n")));
        ParityGate.AssertStable("scripts/refunds.parity", golden: "golden", options);

        // A changed fixture is a golden mismatch until it is accepted again.
        File.AppendAllText(Path.Combine(_dir, "scripts", "tickets.csv"), "5,Bo,40,-3.0,\n");
        var again = Assert.Throws<ParityUnstableException>(() => ParityGate.AssertStable("scripts/refunds.parity", "golden", options));
        Assert.Equal(Cli(_dir, "check", "scripts/refunds.parity").Out, again.Message);
    }

    [Fact]
    public void Checkpoints_come_out_per_mode_with_their_types()
    {
        var result = ParityGate.Run("scripts/refunds.parity", new ParityOptions { WorkingDirectory = _dir });
        Assert.False(result.Passed);                               // nothing accepted yet: every finding is new
        Assert.All(result.Findings, f => Assert.Equal("new", f.Status));
        var legacy = result.Checkpoint("adults", "legacy");
        var modern = result.Checkpoint("adults");
        Assert.Equal("modern", modern.Mode);
        Assert.Equal(2, modern.RowCount);                          // Spec §2.2: a null condition drops the row (ages 34, 71)
        Assert.Equal(new ParityColumn("age", "float64"), legacy.Columns[2]);   // Spec §2.1: int64 with missing is float64 under nan
        Assert.Equal(new ParityColumn("age", "int64"), modern.Columns[2]);
        Assert.Equal(new ParityColumn("passenger", "utf8"), modern.Columns[1]);
        var ex = Assert.Throws<KeyNotFoundException>(() => result.Checkpoint("adultz"));
        Assert.Contains("refunds, adults", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_script_from_text_runs_like_a_file()
    {
        var options = new ParityOptions { WorkingDirectory = Path.Combine(_dir, "scripts"), Modes = ["legacy", "boxed+null+cow"], ScriptName = "adhoc.parity" };
        var result = ParityGate.RunText("load tickets from 'tickets.csv'\nlet t = tickets add l = length(passenger)\ncheck t\n", options);
        Assert.Equal(["adhoc.parity"], result.Scripts);
        Assert.Equal("boxed+null+cow", result.Checkpoints[1].Mode);
        Assert.Equal(4, result.Checkpoint("t", "legacy").RowCount);
    }

    [Fact]
    public void Bad_input_throws_located_messages()
    {
        var options = new ParityOptions { WorkingDirectory = _dir };
        var parse = Assert.Throws<ParityInputException>(() => ParityGate.RunText("load tickets from 'scripts/tickets.csv'\nlet x = tickets wher age > 1\n", options));
        Assert.StartsWith("inline.parity:2:", parse.Message, StringComparison.Ordinal);
        var missing = Assert.Throws<ParityInputException>(() => ParityGate.Run("scripts/none.parity", options));
        Assert.Equal("scripts/none.parity: error E-FILE-NOT-FOUND: no such script or folder", missing.Message);
        var mode = Assert.Throws<ParityInputException>(() => ParityGate.Run("scripts", options with { Modes = ["legacy", "boxed+nan"] }));
        Assert.Contains("'boxed+nan' is not a mode", mode.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void The_public_surface_is_the_documented_api()
    {
        var exported = typeof(ParityGate).Assembly.GetExportedTypes().Select(t => t.FullName).Order(StringComparer.Ordinal);
        Assert.Equal(
            ["Parity.ParityCheckpoint", "Parity.ParityColumn", "Parity.ParityFinding", "Parity.ParityGate", "Parity.ParityGoldenMismatch",
             "Parity.ParityInputException", "Parity.ParityOptions", "Parity.ParityResult", "Parity.ParityUnstableException"],
            exported);
    }
}
