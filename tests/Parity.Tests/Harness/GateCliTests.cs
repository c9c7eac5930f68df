using Parity.Cli;
using Parity.Harness.Golden;

namespace Parity.Tests.Harness;

/// <summary>End to end through <see cref="CliApp.Run"/>: real scripts, the interpreter, the golden store and the exit codes of spec §4.</summary>
public sealed class GateCliTests : IDisposable
{
    private const string Tickets = """
        id,passenger,age,fare,note
        1,Åsa Lindqvist,34,12.5,window
        2,Νίκος Παππάς,,8.0,
        3,李小龍,71,-8.0,refund
        4,Zoë 🚢,17,4.25,
        5,Bo,,20.0,late
        """;

    private const string Refunds = """
        load tickets from 'tickets.csv'
        let adults = tickets where age >= 18
        set (tickets take 3).fare = 0 where fare < 0
        let labels = tickets add age_text = text(age)
        check adults
        check labels as 'with labels'
        """;

    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-cli-" + Guid.NewGuid().ToString("N"));

    public GateCliTests()
    {
        Directory.CreateDirectory(Path.Combine(_dir, "ferry"));
        File.WriteAllText(Path.Combine(_dir, "ferry", "tickets.csv"), Tickets);
        File.WriteAllText(Path.Combine(_dir, "ferry", "refunds.parity"), Refunds);
    }

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    private (int Exit, string Out, string Err) Cli(params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        var exit = CliApp.Run(args, new CliContext(o, e, _dir));
        return (exit, o.ToString(), e.ToString());
    }

    private void Write(string relative, string text) => File.WriteAllText(Path.Combine(_dir, relative), text);

    [Fact]
    public void Run_reports_findings_and_fails_without_a_golden_store()
    {
        var (exit, output, err) = Cli("run", "ferry");
        Assert.Equal(1, exit);
        Assert.Equal("", err);
        Assert.Contains("FAIL  ferry/refunds.parity", output, StringComparison.Ordinal);
        Assert.Contains("alias   line 3", output, StringComparison.Ordinal);          // spec §2.2 chained write
        Assert.Contains("the text 'nan' in legacy where modern has null", output, StringComparison.Ordinal); // spec §2.2 text(x)
        Assert.Contains("rows dropped because the condition was null", output, StringComparison.Ordinal);
        Assert.DoesNotContain("\u001b[", output, StringComparison.Ordinal);           // not interactive: no colour
    }

    [Fact]
    public void Accept_then_check_passes_then_a_data_change_fails_check_but_not_run()
    {
        Assert.Equal(0, Cli("accept", "ferry").Exit);
        Assert.True(File.Exists(Path.Combine(_dir, "golden", "ferry~refunds", "legacy", "with%20labels.frame.txt")));
        var check = Cli("check", "ferry");
        Assert.Equal(0, check.Exit);
        Assert.Contains("PASS  ferry/refunds.parity", check.Out, StringComparison.Ordinal);
        Assert.Equal(0, Cli("run", "ferry").Exit);

        Write("ferry/tickets.csv", Tickets.Replace("5,Bo,,20.0,late", "5,Bo,,21.0,late", StringComparison.Ordinal));
        var failed = Cli("check", "ferry");
        Assert.Equal(1, failed.Exit);
        Assert.Contains("+ 5 | 'Bo' | NaN | 21.0", failed.Out, StringComparison.Ordinal);
        Assert.Equal(0, Cli("run", "ferry").Exit);
    }

    [Fact]
    public void Check_without_golden_fails()
    {
        var (exit, output, _) = Cli("check", "ferry/refunds.parity");
        Assert.Equal(1, exit);
        Assert.Contains("no golden snapshot", output, StringComparison.Ordinal);
    }

    [Fact]
    public void A_new_finding_after_accept_fails_run_and_check()
    {
        Assert.Equal(0, Cli("accept", "ferry").Exit);
        Write("ferry/refunds.parity", Refunds + "\nlet big = tickets where fare > 10\ncheck big\nlet n = tickets add l = length(note)\ncheck n\n");
        var run = Cli("run", "ferry");
        Assert.Equal(1, run.Exit);
        Assert.Contains("new", run.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_errors_are_all_printed_and_exit_2()
    {
        Write("ferry/broken.parity", "load tickets from 'tickets.csv'\nlet a = tickets wher age > 1\nlet b = tickets select\n");
        var (exit, _, err) = Cli("run", "ferry/broken.parity");
        Assert.Equal(2, exit);
        var lines = err.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.True(lines.Length >= 2, err);
        Assert.All(lines, l => Assert.StartsWith("ferry/broken.parity:", l, StringComparison.Ordinal));
        Assert.Contains("ferry/broken.parity:2:", err, StringComparison.Ordinal);
        Assert.Contains("ferry/broken.parity:3:", err, StringComparison.Ordinal);
    }

    [Fact]
    public void An_error_in_every_mode_exits_2_with_the_located_message()
    {
        // Spec §3.5: an error in every mode fails the script with exit code 2.
        Write("ferry/missing.parity", "load tickets from 'nope.csv'\ncheck tickets\n");
        var (exit, _, err) = Cli("run", "ferry/missing.parity");
        Assert.Equal(2, exit);
        Assert.StartsWith("ferry/missing.parity:1:", err, StringComparison.Ordinal);
        Assert.Single(err.Split('\n', StringSplitOptions.RemoveEmptyEntries));
    }

    [Fact]
    public void An_error_in_one_mode_is_an_error_finding()
    {
        // Spec §2.2: cast to int64 with missing values is E-CAST under nan; nulls are kept under null.
        Write("ferry/cast.parity", "load tickets from 'tickets.csv'\ncheck tickets\nlet ages = tickets cast age to int64\ncheck ages\n");
        var (exit, output, err) = Cli("run", "ferry/cast.parity");
        Assert.Equal(1, exit);
        Assert.Equal("", err);
        Assert.Contains("error   line 3", output, StringComparison.Ordinal);
        Assert.Contains("E-CAST in legacy only", output, StringComparison.Ordinal);
        Assert.Contains("never reached: 'ages'", output, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--modes", "legacy,bogus", "'bogus' is not a mode; valid:")]
    [InlineData("--modes", "", "is not a mode")]
    [InlineData("--float-tolerance", "-1", "--float-tolerance")]
    [InlineData("--format", "pdf", "--format needs --out")]
    public void Bad_options_are_usage_errors(string option, string value, string message)
    {
        var (exit, _, err) = Cli("run", "ferry", option, value);
        Assert.Equal(2, exit);
        Assert.Contains("error E-USAGE", err, StringComparison.Ordinal);
        Assert.Contains(message, err, StringComparison.Ordinal);
    }

    [Fact]
    public void Unknown_format_lists_the_valid_ones()
    {
        var (exit, _, err) = Cli("run", "ferry", "--out", "out", "--format", "md,pdf");
        Assert.Equal(2, exit);
        Assert.Contains("md, json, junit, html", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Reports_are_written_to_out_in_the_formats_asked()
    {
        var (exit, _, _) = Cli("run", "ferry", "--out", "out", "--format", "md,json");
        Assert.Equal(1, exit);
        Assert.True(File.Exists(Path.Combine(_dir, "out", "report.md")));
        Assert.True(File.Exists(Path.Combine(_dir, "out", "report.json")));
        Assert.False(File.Exists(Path.Combine(_dir, "out", "report.html")));
    }

    [Fact]
    public void A_missing_script_is_bad_input()
    {
        var (exit, _, err) = Cli("check", "ferry/nope.parity");
        Assert.Equal(2, exit);
        Assert.Contains("ferry/nope.parity: error E-FILE-NOT-FOUND", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Accept_refuses_while_another_accept_holds_the_lock()
    {
        using (GoldenLock.Acquire(Path.Combine(_dir, "golden"), "golden"))
        {
            var (exit, _, err) = Cli("accept", "ferry");
            Assert.Equal(2, exit);
            Assert.StartsWith("golden/.lock: error E-GOLDEN-LOCK:", err, StringComparison.Ordinal);
        }
        Assert.Equal(0, Cli("accept", "ferry").Exit);
    }

    [Fact]
    public void A_corrupted_golden_file_is_a_located_error_with_exit_2()
    {
        Assert.Equal(0, Cli("accept", "ferry").Exit);
        var path = Path.Combine(_dir, "golden", "ferry~refunds", "modern", "adults.frame.txt");
        File.WriteAllText(path, File.ReadAllText(path).Replace("'window'", "'window", StringComparison.Ordinal));
        var (exit, _, err) = Cli("check", "ferry");
        Assert.Equal(2, exit);
        Assert.Matches(@"^golden/ferry~refunds/modern/adults\.frame\.txt:\d+:\d+: error E-GOLDEN: ", err);
    }

    [Fact]
    public void Golden_option_moves_the_store()
    {
        Assert.Equal(0, Cli("accept", "ferry", "--golden", "snap").Exit);
        Assert.True(Directory.Exists(Path.Combine(_dir, "snap", "ferry~refunds")));
        Assert.Equal(0, Cli("check", "ferry", "--golden", "snap").Exit);
        Assert.Equal(1, Cli("check", "ferry").Exit);
    }

    [Fact]
    public void Matrix_attributes_each_finding_to_an_axis()
    {
        // Spec §4: matrix exits 1 while a finding is not accepted, 0 once it is.
        var (exit, output, err) = Cli("matrix", "ferry/refunds.parity");
        Assert.Equal(1, exit);
        Assert.Equal("", err);
        Assert.Equal(0, Cli("accept", "ferry").Exit);
        Assert.Equal(0, Cli("matrix", "ferry").Exit);
        Assert.Contains("strings  missing  writes", output, StringComparison.Ordinal);
        // The chained write differs by the writes axis only (spec §2.2).
        Assert.Matches(@"alias line 3\s+-\s+-\s+4/4", output);
        // int64 against float64 for age comes from the missing axis (spec §2.1).
        Assert.Matches(@"type line 5 checkpoint 'adults' column 'age'\s+-\s+4/4\s+-", output);
    }

    [Fact]
    public void Modes_all_compares_the_baseline_with_every_other_mode()
    {
        var (exit, output, _) = Cli("run", "ferry", "--modes", "all");
        Assert.Equal(1, exit);
        Assert.Contains("boxed+null+alias", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Frames_above_the_row_limit_are_stored_as_arrow_and_still_gate()
    {
        Assert.Equal(0, Cli("accept", "ferry", "--row-limit", "2").Exit);
        var dir = Path.Combine(_dir, "golden", "ferry~refunds", "legacy");
        Assert.True(File.Exists(Path.Combine(dir, "with%20labels.frame.arrow")));
        Assert.Contains("sha256 ", File.ReadAllText(Path.Combine(dir, "with%20labels.frame.txt")), StringComparison.Ordinal);
        Assert.Equal(0, Cli("check", "ferry", "--row-limit", "2").Exit);
        Write("ferry/tickets.csv", Tickets.Replace("5,Bo,,20.0,late", "5,Bo,,21.0,late", StringComparison.Ordinal));
        Assert.Equal(1, Cli("check", "ferry", "--row-limit", "2").Exit);
    }

    [Fact]
    public void Data_values_cannot_drive_the_terminal_even_in_colour()
    {
        // A note holding an OSC "set window title" sequence (ECMA-48 control functions) must show as escapes.
        Write("ferry/tickets.csv", Tickets.Replace("refund", "re\u001b]0;pwned\u0007fund", StringComparison.Ordinal));
        // Spec §2.2: not (age < 18) keeps missing ages under nan and drops them under null, so rows differ.
        Write("ferry/refunds.parity", "load tickets from 'tickets.csv'\nlet grown = tickets where not (age < 18)\ncheck grown\n");
        var o = new StringWriter();
        var e = new StringWriter();
        var exit = CliApp.Run(["run", "ferry"], new CliContext(o, e, _dir) { Interactive = true });
        Assert.Equal(1, exit);
        var output = o.ToString();
        Assert.Contains("\u001b[", output, StringComparison.Ordinal);        // colour is on
        Assert.DoesNotContain("\u001b]0;", output, StringComparison.Ordinal); // but no data-driven sequence
        Assert.DoesNotContain("\u0007", output, StringComparison.Ordinal);
        Assert.Contains("pwned", output, StringComparison.Ordinal);
    }
}
