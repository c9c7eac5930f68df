using Parity.Tests.Reliability;

namespace Parity.Tests.Harness;

/// <summary>
/// Set-up mistakes are bad input (exit 2, one line, before any work), and the project file: its settings,
/// command-line overrides, expect rules, stale golden folders and parallel scripts.
/// </summary>
public sealed class GateSetupTests : IDisposable
{
    private readonly CliSandbox _box = new();

    public GateSetupTests()
    {
        _box.Write("ferry/tickets.csv", "id,passenger,age,fare,note\n1,Åsa,34,12.5,window\n2,Νίκος,,8.0,\n3,李小龍,71,-8.0,refund\n");
        _box.Write("ferry/refunds.parity", "load tickets from 'tickets.csv'\nlet adults = tickets where age >= 18\ncheck adults\n");
    }

    public void Dispose() => _box.Dispose();

    /// <summary>Exit 2, nothing on stdout, exactly one line on stderr, which starts as given.</summary>
    private void AssertMistake((int Exit, string Out, string Err) result, string start)
    {
        Assert.Equal(2, result.Exit);
        Assert.Equal("", result.Out);
        var lines = result.Err.TrimEnd('\n').Split('\n');
        Assert.Single(lines);
        Assert.StartsWith(start, lines[0].TrimEnd('\r'), StringComparison.Ordinal);
    }

    [Fact]
    public void An_unknown_option_is_named_with_the_nearest_one_not_taken_for_a_script()
    {
        AssertMistake(_box.Cli("run", "ferry", "--fromat", "md"), "parity: error E-USAGE: unknown option '--fromat' for run (did you mean '--format'?)");
    }

    [Fact]
    public void An_unknown_command_is_named_with_the_nearest_one()
    {
        AssertMistake(_box.Cli("chek", "ferry"), "parity: error E-USAGE: unknown command 'chek' (did you mean 'check'?)");
    }

    [Fact]
    public void Check_against_a_golden_folder_that_does_not_exist_is_bad_input()
    {
        AssertMistake(_box.Cli("check", "ferry", "--golden", "gold"), "parity: error E-USAGE: --golden: no such folder 'gold'");
    }

    [Fact]
    public void One_mode_is_nothing_to_compare()
    {
        AssertMistake(_box.Cli("run", "ferry", "--modes", "legacy"), "parity: error E-USAGE: --modes: run compares modes and needs at least two");
        AssertMistake(_box.Cli("check", "ferry", "--modes", "modern,modern"), "parity: error E-USAGE: --modes: check compares modes and needs at least two");
    }

    [Fact]
    public void An_out_folder_that_is_a_file_is_bad_input_before_any_work()
    {
        _box.Write("report", "not a folder");
        AssertMistake(_box.Cli("run", "ferry", "--out", "report"), "parity: error E-USAGE: --out: 'report' is a file, not a folder");
        Assert.Equal("not a folder", File.ReadAllText(_box.PathOf("report")));
    }

    [Fact]
    public void A_mistake_in_the_project_file_is_located_in_it()
    {
        _box.Write("parity.json", "{\n  // defaults\n  \"modes\": [\"legacy\", \"modern\"],\n  \"fromats\": [\"md\"]\n}\n");
        AssertMistake(_box.Cli("run", "ferry"), "parity.json:4:3: error E-CONFIG: unknown key 'fromats' (did you mean 'formats'?)");
    }

    [Fact]
    public void A_config_file_that_does_not_exist_is_bad_input()
    {
        AssertMistake(_box.Cli("run", "ferry", "--config", "conf/parity.json"), "conf/parity.json: error E-FILE-NOT-FOUND: no such project file");
    }

    [Fact]
    public void Command_line_options_override_the_project_file()
    {
        _box.Write("parity.json", """
            {
              "scripts": ["ferry/*.parity"],
              "modes": ["legacy", "boxed+null+alias"],
              "golden": "nowhere",
              "out": "out/from-file",
              "formats": ["json"]
            }
            """);
        // From the file: the scripts (a glob), the modes, the golden folder (check: it must exist), the output.
        var run = _box.Cli("run");
        Assert.Equal(1, run.Exit);
        Assert.Contains("FAIL  ferry/refunds.parity", run.Out, StringComparison.Ordinal);
        Assert.Contains("boxed+null+alias", run.Out, StringComparison.Ordinal);
        Assert.True(File.Exists(_box.PathOf("out/from-file/report.json")));
        Assert.False(File.Exists(_box.PathOf("out/from-file/report.md")));
        AssertMistake(_box.Cli("check"), "parity: error E-USAGE: --golden: no such folder");

        // On the command line: each overrides its setting of the file.
        var over = _box.Cli("run", "ferry/refunds.parity", "--modes", "legacy,modern", "--out", "out/cli", "--format", "md");
        Assert.Contains("modern", over.Out, StringComparison.Ordinal);
        Assert.DoesNotContain("boxed+null+alias", over.Out, StringComparison.Ordinal);
        Assert.True(File.Exists(_box.PathOf("out/cli/report.md")));
        Assert.Equal(0, _box.Cli("accept", "--golden", "golden").Exit);
        Assert.Equal(0, _box.Cli("check", "--golden", "golden").Exit);
    }

    [Fact]
    public void A_deleted_script_leaves_a_stale_golden_folder_that_fails_check_until_pruned()
    {
        _box.Write("ferry/old.parity", "load tickets from 'tickets.csv'\ncheck tickets\n");
        Assert.Equal(0, _box.Cli("accept", "ferry").Exit);
        File.Delete(_box.PathOf("ferry/old.parity"));
        var check = _box.Cli("check", "ferry");
        Assert.Equal(1, check.Exit);
        Assert.Contains("stale golden folder golden/ferry~old: no script ferry/old.parity", check.Out, StringComparison.Ordinal);
        Assert.Contains("failed: 1 of 2 scripts", check.Out, StringComparison.Ordinal);
        Assert.Contains("; 1 golden mismatch", check.Out, StringComparison.Ordinal);
        // A script checked by path says nothing about its neighbours.
        Assert.Equal(0, _box.Cli("check", "ferry/refunds.parity").Exit);

        var prune = _box.Cli("accept", "ferry", "--prune");
        Assert.Equal(0, prune.Exit);
        Assert.Contains("pruned ferry/old.parity", prune.Out, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_box.PathOf("golden/ferry~old")));
        Assert.Equal(0, _box.Cli("check", "ferry").Exit);
    }

    [Fact]
    public void A_data_file_error_names_the_resolved_data_file_and_keeps_the_script_location()
    {
        _box.Write("ferry/broken.csv", "a,b\n1,\"x\n");
        _box.Write("ferry/sub/bad.parity", "load t from '../broken.csv'\ncheck t\n");
        var (exit, _, err) = _box.Cli("run", "ferry/sub/bad.parity");
        Assert.Equal(2, exit);
        // RFC 4180: a quoted field must be closed; the data file is named as resolved, not as written.
        Assert.StartsWith("ferry/sub/bad.parity:1:13: error E-CSV-QUOTE: ", err, StringComparison.Ordinal);
        Assert.Contains("(data file ferry/broken.csv:2:", err, StringComparison.Ordinal);
        _box.Write("ferry/sub/gone.parity", "load t from '../gone.csv'\ncheck t\n");
        Assert.Contains("no such file (data file ferry/gone.csv)", _box.Cli("run", "ferry/sub/gone.parity").Err, StringComparison.Ordinal);
    }
}
