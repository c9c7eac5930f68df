using Parity.Harness.Reports;

namespace Parity.Tests.Reports;

public sealed class TerminalSummaryTests
{
    private static string Render(Parity.Harness.Findings.GateReport report, bool colour, TerminalOptions? options = null)
    {
        using var w = new StringWriter { NewLine = "\n" };
        TerminalSummary.Write(report, w, colour, options ?? TerminalOptions.Default);
        return w.ToString();
    }

    [Fact]
    public void Golden_mismatch_rows_are_side_by_side_with_changed_cells_in_brackets_and_capped()
    {
        var lines = Render(ReportFixtures.Hostile(), colour: false).Split('\n');
        Assert.Contains(lines, l => l.StartsWith("      golden row 1: 2 | ['", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("      now    row 1: 2 | ['", StringComparison.Ordinal));
        var capped = Render(ReportFixtures.Hostile(), colour: false, new TerminalOptions { MaxDiffRows = 0 }).Split('\n');
        Assert.DoesNotContain(capped, l => l.Contains("golden row 1", StringComparison.Ordinal));
        Assert.Contains(capped, l => l.Contains("1 more row not listed", StringComparison.Ordinal));
    }

    [Fact]
    public void Lists_scripts_then_one_line_per_finding_with_samples_for_new_ones()
    {
        var text = Render(ReportFixtures.Ordinary(), colour: false);
        var lines = text.Split('\n');
        Assert.Equal("FAIL  ferry/tickets.parity  2 checkpoints, findings: 1 type, 1 missing, 1 alias (2 new, 1 accepted)", lines[0]);
        Assert.Equal("  type    line 4  checkpoint 'adults'  column 'age'  x1  new  column 'age' is float64 under legacy and int64 under modern", lines[1]);
        // Accepted findings fold into one count line unless --show-accepted.
        Assert.Contains("  accepted: 1 finding (1 missing); --show-accepted lists them", lines);
        var shown = Render(ReportFixtures.Ordinary(), colour: false, new TerminalOptions { ShowAccepted = true }).Split('\n');
        Assert.Contains("  missing line 4  checkpoint 'adults'  column 'age'  x2  accepted  missing ages print NaN under legacy and null under modern", shown);
        // Samples only for findings that need a decision; the accepted one stays a single line.
        Assert.DoesNotContain("      row 3:  legacy NaN  |  modern null", lines);
        Assert.Contains("      legacy 'cheap', 'tickets'  |  modern 'cheap'", lines);
        Assert.Contains("PASS  ferry/routes.parity  1 checkpoint, findings: none (1 resolved)", lines);
        // The last line counts scripts failed, findings by status and golden mismatches; then the next step.
        Assert.Equal("failed: 1 of 2 scripts; findings: 2 new, 1 accepted, 1 resolved; 0 golden mismatches", lines[^3]);
        Assert.StartsWith("next: ", lines[^2], StringComparison.Ordinal);
    }

    [Fact]
    public void Show_accepted_lists_folded_findings_and_quiet_prints_only_the_summary()
    {
        var shown = Render(ReportFixtures.Ordinary(), colour: false, new TerminalOptions { ShowAccepted = true }).Split('\n');
        Assert.DoesNotContain(shown, l => l.StartsWith("  accepted: ", StringComparison.Ordinal));
        // A resolved finding stays one line in either view: it is news, not a decision.
        Assert.Contains(Render(ReportFixtures.Ordinary(), colour: false).Split('\n'), l => l.Contains("  resolved  gone", StringComparison.Ordinal));
        var lines = Render(ReportFixtures.Ordinary(), colour: false, new TerminalOptions { Quiet = true }).Split('\n');
        Assert.Equal(5, lines.Length); // two script lines, the last line, the next step, and the final newline
        Assert.StartsWith("FAIL  ferry/tickets.parity", lines[0], StringComparison.Ordinal);
        Assert.StartsWith("failed: 1 of 2 scripts", lines[2], StringComparison.Ordinal);
    }

    // ECMA-48 control functions start with ESC (U+001B): without colour no ESC at all is written.
    [Fact]
    public void No_escape_sequences_without_colour_and_none_from_data_with_colour()
    {
        var plain = Render(ReportFixtures.Hostile(), colour: false);
        foreach (var c in plain)
            Assert.False(c < ' ' && c != '\n', "control character U+" + ((int)c).ToString("X4", System.Globalization.CultureInfo.InvariantCulture));
        Assert.Contains("bell\\u{7}esc\\u{1B}[31mred\\u{0}nul", plain, StringComparison.Ordinal);

        var coloured = Render(ReportFixtures.Hostile(), colour: true);
        Assert.Contains("\u001b[31m\u001b[1mFAIL\u001b[0m", coloured, StringComparison.Ordinal);
        Assert.DoesNotContain("esc\u001b", coloured, StringComparison.Ordinal);
        Assert.DoesNotContain('\u0007', coloured);
        Assert.DoesNotContain('\u2028', coloured);
    }

    [Fact]
    public void Every_finding_is_one_line()
    {
        var lines = Render(ReportFixtures.Hostile(), colour: false).Split('\n');
        Assert.Equal(ReportFixtures.HostileTexts.Count, lines.Count(l => l.StartsWith("  value ", StringComparison.Ordinal) || l.StartsWith("  missing ", StringComparison.Ordinal)));
    }
}
