using System.Text.RegularExpressions;
using Parity.Harness.Reports;

namespace Parity.Tests.Reports;

/// <summary>The HTML report as a browser renders it (headless Chromium, --dump-dom after scripts ran).</summary>
public sealed class HtmlBrowserTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-html-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    private string WriteHostile()
    {
        new HtmlReportWriter().Write(ReportFixtures.Hostile(), _dir);
        return Path.Combine(_dir, "report.html");
    }

    [ChromiumFact]
    public void Renders_findings_and_injected_script_does_not_run()
    {
        var dom = Chromium.DumpDom(WriteHostile());
        // The injected value would set the title to 'pwned' if it ran.
        Assert.Contains("<title>Parity report</title>", dom, StringComparison.Ordinal);
        Assert.DoesNotContain("<title>pwned", dom, StringComparison.Ordinal);
        Assert.Equal(ReportFixtures.HostileTexts.Count, Regex.Count(dom, "<article class=\"finding "));
        Assert.Contains("message &lt;script&gt;document.title='pwned'&lt;/script&gt;", dom, StringComparison.Ordinal);
        Assert.DoesNotContain("<img", dom, StringComparison.OrdinalIgnoreCase);
        // The page's own script ran under its Content-Security-Policy: nothing hidden, count filled in.
        Assert.Contains("Showing 8 of 8 findings.", dom, StringComparison.Ordinal);
        Assert.DoesNotContain(" hidden", dom, StringComparison.Ordinal);
    }

    [ChromiumFact]
    public void Filter_by_kind_hides_the_other_kinds()
    {
        var dom = Chromium.DumpDom(WriteHostile(), "#kinds=value");
        var articles = Regex.Matches(dom, "<article [^>]*>").Select(m => m.Value).ToList();
        Assert.Equal(8, articles.Count);
        foreach (var a in articles)
        {
            var hidden = a.Contains(" hidden", StringComparison.Ordinal);
            Assert.Equal(!a.Contains("data-kind=\"value\"", StringComparison.Ordinal), hidden);
        }
        Assert.Contains("Showing 4 of 8 findings.", dom, StringComparison.Ordinal);
        Assert.Matches("<input type=\"checkbox\" name=\"kind\" value=\"value\"[^>]*>", dom);
    }
}
