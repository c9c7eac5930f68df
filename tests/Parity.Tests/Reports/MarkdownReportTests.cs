using System.Net;
using System.Text;
using Parity.Harness.Formatting;
using Parity.Harness.Reports;

namespace Parity.Tests.Reports;

public sealed class MarkdownReportTests
{
    private static string Render() => new MarkdownReportWriter().Render(ReportFixtures.Hostile());

    // Spec §5: Markdown for a pull request: summary table, then details per finding.
    [Fact]
    public void Has_a_summary_table_and_details_per_finding()
    {
        var md = new MarkdownReportWriter().Render(ReportFixtures.Ordinary());
        Assert.Contains("| script | checkpoints | shape | type | value | missing | alias | warning | error | golden | status |", md, StringComparison.Ordinal);
        // Resolved findings are not counted: routes has 0 value findings and passes.
        Assert.Contains("| ferry/routes.parity | 1 | 0 | 0 | 0 | 0 | 0 | 0 | 0 | 0 | passed |", md, StringComparison.Ordinal);
        Assert.Contains("| ferry/tickets.parity | 2 | 0 | 1 | 0 | 1 | 1 | 0 | 0 | 0 | **failed** |", md, StringComparison.Ordinal);
        Assert.Contains("- **count:** 2\n", md, StringComparison.Ordinal);
        Assert.Contains("| row | legacy | modern |", md, StringComparison.Ordinal);
        Assert.Contains("| 3 | NaN | null |", md, StringComparison.Ordinal);
    }

    // CommonMark "Backslash escapes" and "Entity and numeric character references": markup in data is inert.
    [Fact]
    public void No_markup_from_data_survives()
    {
        var md = Render();
        Assert.DoesNotContain('<', md);
        Assert.DoesNotContain('\u2028', md);
        Assert.DoesNotContain('\u2029', md);
        foreach (var c in md)
            Assert.False(c < ' ' && c != '\n', "raw control character in Markdown");
        foreach (var line in md.Split('\n'))
        {
            if (line.StartsWith("```", StringComparison.Ordinal) || line.StartsWith("- '", StringComparison.Ordinal) || line.StartsWith("+ '", StringComparison.Ordinal))
                continue; // inside the fenced excerpt
            for (var i = 0; i < line.Length; i++)
                if (line[i] is '`' or '*' or '_' or '[' or '$' or '~')
                    Assert.True(IsEscaped(line, i) || IsBoldMarker(line, i), "unescaped '" + line[i] + "' in: " + line);
        }
    }

    // GitHub-flavoured Markdown tables: a pipe in a cell must be escaped or it splits the row.
    [Fact]
    public void Table_rows_keep_their_cell_count()
    {
        var header = -1;
        foreach (var line in Render().Split('\n'))
        {
            if (!line.StartsWith("| ", StringComparison.Ordinal))
            {
                header = -1;
                continue;
            }
            var pipes = 0;
            for (var i = 0; i < line.Length; i++)
                if (line[i] == '|' && !IsEscaped(line, i)) pipes++;
            if (header < 0) header = pipes;
            Assert.Equal(header, pipes);
        }
    }

    // Common practice, no source: reading the escaped text back gives the value with control characters made visible.
    [Fact]
    public void Messages_read_back_as_the_data()
    {
        var lines = Render().Split('\n').Where(l => l.StartsWith("- **message:** ", StringComparison.Ordinal)).ToList();
        Assert.Equal(ReportFixtures.HostileTexts.Count, lines.Count);
        for (var i = 0; i < lines.Count; i++)
        {
            var back = Unescape(lines[i]["- **message:** ".Length..]);
            Assert.Equal(CellText.Safe("message " + ReportFixtures.HostileTexts[i]), back);
        }
    }

    // CommonMark backslash escapes: golden record changes stay inside their table cells, control characters visible.
    [Fact]
    public void Golden_changes_are_escaped_and_changed_cells_marked_without_colour()
    {
        var md = Render();
        Assert.Contains(@"'b' bell\\u\{7\}esc\\u\{1B\}\[31mred\\u\{0\}nul", md, StringComparison.Ordinal);
        Assert.Contains("| now | 1 | 2 | **", md, StringComparison.Ordinal);
        Assert.Contains("** ✱ |", md, StringComparison.Ordinal);
    }

    private static bool IsEscaped(string line, int i)
    {
        var n = 0;
        for (var j = i - 1; j >= 0 && line[j] == '\\'; j--) n++;
        return n % 2 == 1;
    }

    private static bool IsBoldMarker(string line, int i) =>
        line[i] == '*' && ((i + 1 < line.Length && line[i + 1] == '*') || (i > 0 && line[i - 1] == '*' && !IsEscaped(line, i - 1)));

    private static string Unescape(string s)
    {
        var sb = new StringBuilder();
        for (var i = 0; i < s.Length; i++)
        {
            if (s[i] == '\\' && i + 1 < s.Length) { sb.Append(s[i + 1]); i++; continue; }
            sb.Append(s[i]);
        }
        return WebUtility.HtmlDecode(sb.ToString()).Replace('\u00A0', ' ');
    }
}
