namespace Parity.Harness.Reports;

/// <summary>The report formats by name, for <c>--format md,json,junit,html</c>.</summary>
public static class ReportWriters
{
    /// <summary>The format names, in the order of spec §4.</summary>
    public static IReadOnlyList<string> Formats { get; } = ["md", "json", "junit", "html"];

    /// <summary>
    /// Writers for the named formats, in the order given, without duplicates. Names are case-insensitive and
    /// an entry may itself be a comma-separated list. An unknown name throws <see cref="ArgumentException"/>
    /// whose message lists the valid names (the CLI turns it into a usage error).
    /// </summary>
    public static IReadOnlyList<IReportWriter> Create(IEnumerable<string> formats) => Create(formats, GoldenDiffText.DefaultMaxRows);

    /// <summary>As above; <paramref name="maxDiffRows"/> caps the rows listed per golden mismatch in Markdown and HTML (<c>--max-diff-rows</c>).</summary>
    public static IReadOnlyList<IReportWriter> Create(IEnumerable<string> formats, int maxDiffRows)
    {
        var writers = new List<IReportWriter>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var entry in formats)
        {
            foreach (var part in entry.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
            {
                var name = part.ToLowerInvariant();
                if (!seen.Add(name)) continue;
                writers.Add(CreateOne(name, maxDiffRows) ?? throw new ArgumentException(
                    "unknown report format '" + Internal.SafeText.Visible(part) + "'; valid: " + string.Join(", ", Formats)));
            }
        }
        return writers;
    }

    private static IReportWriter? CreateOne(string name, int maxDiffRows) => name switch
    {
        "md" => new MarkdownReportWriter { MaxDiffRows = maxDiffRows },
        "json" => new JsonReportWriter(),
        "junit" => new JUnitReportWriter(),
        "html" => new HtmlReportWriter { MaxDiffRows = maxDiffRows },
        _ => null,
    };
}
