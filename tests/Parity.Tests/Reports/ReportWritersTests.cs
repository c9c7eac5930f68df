using Parity.Harness.Reports;

namespace Parity.Tests.Reports;

public sealed class ReportWritersTests
{
    // Spec §4: --format md,json,junit,html.
    [Fact]
    public void Creates_writers_in_order_without_duplicates_case_insensitively()
    {
        var writers = ReportWriters.Create(["md,JSON", "junit", "md", " html "]);
        Assert.Equal(["md", "json", "junit", "html"], writers.Select(w => w.Format));
        Assert.Equal(["report.md", "report.json", "junit.xml", "report.html"], writers.Select(w => w.FileName));
    }

    [Fact]
    public void Unknown_format_is_an_argument_error_listing_the_valid_ones()
    {
        var ex = Assert.Throws<ArgumentException>(() => ReportWriters.Create(["md", "pdf"]));
        Assert.Contains("'pdf'", ex.Message, StringComparison.Ordinal);
        Assert.Contains("md, json, junit, html", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Writes_every_format_atomically_without_leftover_temporary_files()
    {
        var dir = Path.Combine(Path.GetTempPath(), "parity-reports-" + Guid.NewGuid().ToString("N"));
        try
        {
            Directory.CreateDirectory(dir);
            var report = ReportFixtures.Hostile();
            var writers = ReportWriters.Create(ReportWriters.Formats);
            foreach (var w in writers)
            {
                File.WriteAllText(Path.Combine(dir, w.FileName), "old content");
                w.Write(report, dir);
                Assert.Equal(w.Render(report), File.ReadAllText(Path.Combine(dir, w.FileName)));
            }
            Assert.Equal(writers.Select(w => w.FileName).Order(StringComparer.Ordinal), Directory.GetFiles(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Writing_creates_the_output_directory()
    {
        var dir = Path.Combine(Path.GetTempPath(), "parity-reports-" + Guid.NewGuid().ToString("N"), "nested", "out");
        try
        {
            new JsonReportWriter().Write(ReportFixtures.Ordinary(), dir);
            Assert.True(File.Exists(Path.Combine(dir, "report.json")));
        }
        finally
        {
            var root = Path.GetFullPath(Path.Combine(dir, "..", ".."));
            if (Directory.Exists(root)) Directory.Delete(root, recursive: true);
        }
    }

    [Fact]
    public void Every_format_renders_the_same_report_identically_twice()
    {
        foreach (var w in ReportWriters.Create(ReportWriters.Formats))
            Assert.Equal(w.Render(ReportFixtures.Hostile()), w.Render(ReportFixtures.Hostile()));
    }
}
