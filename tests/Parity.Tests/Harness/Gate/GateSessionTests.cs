using Parity.Cli;
using Parity.Harness.Findings;
using Parity.Harness.Gate;
using Parity.Tests.Engine.IO;

namespace Parity.Tests.Harness.Gate;

/// <summary>The gate session on the committed demo and on a scratch project; the CLI adds only printing.</summary>
public sealed class GateSessionTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-gate-" + Guid.NewGuid().ToString("N"));

    public GateSessionTests()
    {
        Directory.CreateDirectory(_dir);
        File.WriteAllText(Path.Combine(_dir, "tickets.csv"), "id,passenger,age,fare\n1,Åsa,34,12.5\n2,Νίκος,,8.0\n3,李,71,-8.0\n");
        File.WriteAllText(Path.Combine(_dir, "fares.parity"), "load tickets from 'tickets.csv'\nlet adults = tickets where age >= 18\ncheck adults\n");
    }

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    [Fact]
    public void Check_of_the_demo_passes_against_the_committed_golden_store()
    {
        var session = new GateSession(new GateOptions { WorkingDirectory = TestFiles.RepoRoot });
        var result = session.Check(["fixtures/scripts"]);
        Assert.Empty(result.Problems);
        Assert.False(result.Failed);
        Assert.Equal(4, result.Report.Scripts.Count);
        foreach (var s in result.Report.Scripts)
        {
            Assert.Empty(s.GoldenMismatches);
            Assert.NotEmpty(s.Checkpoints);
            Assert.All(s.Findings, f => Assert.Equal(FindingStatus.Accepted, f.Status));
        }
    }

    [Fact]
    public void Run_then_accept_then_check_on_a_new_project()
    {
        var session = new GateSession(new GateOptions { WorkingDirectory = _dir, KeepRuns = true });
        var run = session.Run(["fares.parity"]);
        Assert.True(run.Failed);                                   // findings with no accepted set are new
        Assert.All(run.Report.Scripts[0].Findings, f => Assert.Equal(FindingStatus.New, f.Status));
        Assert.Single(run.Outcomes);
        Assert.Equal(2, run.Outcomes[0].Runs.Count);

        var missing = session.Check(["fares.parity"]);
        Assert.True(missing.Failed);                               // no golden snapshot yet

        var accepted = session.Accept(["fares.parity"]);
        var one = Assert.Single(accepted.Scripts);
        Assert.Equal(new AcceptedScript("fares.parity", null, 1, 2, run.Report.Scripts[0].Findings.Count, "golden/fares"), one);

        var check = session.Check(["fares.parity"]);
        Assert.False(check.Failed);
        Assert.Empty(check.Problems);
    }

    [Fact]
    public void Bad_arguments_and_scripts_become_problems_not_exceptions()
    {
        File.WriteAllText(Path.Combine(_dir, "broken.parity"), "load tickets from 'tickets.csv'\nlet x = tickets wher age > 1\n");
        var session = new GateSession(new GateOptions { WorkingDirectory = _dir });
        var result = session.Run(["nowhere", "broken.parity", "fares.parity"]);
        Assert.True(result.HasBadInput);
        Assert.Equal("nowhere: error E-FILE-NOT-FOUND: no such script or folder", result.Problems[0]);
        Assert.StartsWith("broken.parity:2:", result.Problems[1], StringComparison.Ordinal);
        Assert.Equal("fares.parity", Assert.Single(result.Report.Scripts).Script);

        var matrix = session.Matrix(["nowhere"]);
        Assert.Empty(matrix.Scripts);                              // nothing runs when an argument is missing
        Assert.Single(matrix.Problems);
    }

    [Fact]
    public void Show_reports_a_missing_script_as_a_message()
    {
        var session = new GateSession(new GateOptions { WorkingDirectory = _dir });
        var shown = session.Show("gone.parity", "adults", GateModes.DefaultSingle);
        Assert.Null(shown.Table);
        Assert.Equal(["gone.parity: error E-FILE-NOT-FOUND: no such script"], shown.Messages);
        Assert.Equal(2, session.Show("fares.parity", "adults", GateModes.DefaultSingle).Table!.RowCount);
    }

    [Fact]
    public void No_cli_file_reaches_into_engine_or_script_types()
    {
        // The CLI parses options and prints; the work is the gate session's (DEVELOPERS.md, Architecture).
        var cli = Path.Combine(TestFiles.RepoRoot, "src", "Parity.Cli");
        foreach (var file in Directory.EnumerateFiles(cli, "*.cs", SearchOption.AllDirectories))
        {
            if (file.Contains(Path.DirectorySeparatorChar + "obj" + Path.DirectorySeparatorChar, StringComparison.Ordinal)) continue;
            var text = File.ReadAllText(file);
            Assert.False(text.Contains("Parity.Engine", StringComparison.Ordinal) || text.Contains("Parity.Script", StringComparison.Ordinal)
                || text.Contains("Engine.", StringComparison.Ordinal) || text.Contains("Script.Running", StringComparison.Ordinal), file);
        }
        Assert.NotNull(typeof(CliApp));
    }
}
