using System.Net;
using System.Text.RegularExpressions;
using Parity.Harness.Formatting;
using Parity.Harness.Reports;

namespace Parity.Tests.Reports;

public sealed class HtmlReportTests
{
    private static string Render() => new HtmlReportWriter().Render(ReportFixtures.Hostile());

    // Spec §5: a single self-contained HTML file: no external resources.
    [Fact]
    public void Is_self_contained()
    {
        var html = new HtmlReportWriter().Render(ReportFixtures.Ordinary());
        Assert.StartsWith("<!DOCTYPE html>", html, StringComparison.Ordinal);
        Assert.DoesNotContain(" src=", html, StringComparison.Ordinal);
        Assert.DoesNotContain(" href=", html, StringComparison.Ordinal);
        Assert.DoesNotContain("@import", html, StringComparison.Ordinal);
        Assert.DoesNotContain("url(", html, StringComparison.Ordinal);
        Assert.Equal(4, Regex.Count(html, "<article class=\"finding "));
        Assert.Contains("data-kind=\"alias\"", html, StringComparison.Ordinal);
    }

    // HTML Living Standard, "Serializing HTML fragments" escaping rules: data can never open a tag.
    [Fact]
    public void Hostile_values_are_escaped_text()
    {
        var html = Render();
        Assert.Equal(1, Regex.Count(html, "<script", RegexOptions.IgnoreCase));
        Assert.DoesNotContain("<img", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<b>", html, StringComparison.Ordinal);
        Assert.DoesNotContain('\u2028', html);
        Assert.Contains("&lt;script&gt;document.title=&#39;pwned&#39;&lt;/script&gt;", html, StringComparison.Ordinal);
        foreach (var c in html)
            Assert.False(c < ' ' && c != '\n', "raw control character in HTML");
        // Every sample cell decodes back to the value with control characters made visible.
        var cells = Regex.Matches(html, "<td class=\"v\">(.*?)</td>").Select(m => WebUtility.HtmlDecode(m.Groups[1].Value)).ToList();
        foreach (var value in ReportFixtures.HostileTexts)
            Assert.Contains(CellText.Safe("'" + value + "'"), cells);
    }

    [Fact]
    public void Script_block_holds_no_data_and_is_allowed_by_hash()
    {
        var html = Render();
        var script = Regex.Match(html, "<script>(.*?)</script>", RegexOptions.Singleline).Groups[1].Value;
        Assert.DoesNotContain("pwned", script, StringComparison.Ordinal);
        Assert.DoesNotContain("ferry", script, StringComparison.Ordinal);
        // CSP Level 3 "hash-source": sha256 of the script's UTF-8 text, base64.
        var hash = Convert.ToBase64String(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(script)));
        Assert.Contains("script-src 'sha256-" + hash + "'", html, StringComparison.Ordinal);
    }
}
