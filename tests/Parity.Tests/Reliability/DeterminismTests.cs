using System.Globalization;
using System.Text;
using System.Text.Json;
using Parity.Tests.Engine.IO;

namespace Parity.Tests.Reliability;

/// <summary>
/// The same inputs give byte-identical golden files and reports (md, json, junit, html) across runs, cultures
/// and time zones, and both string storages give the same rows where spec §2 says they agree. The reports
/// have no generated_at unless asked, so the bytes are compared whole.
/// </summary>
public sealed class DeterminismTests : IDisposable
{
    private readonly CliSandbox _box = new();

    public DeterminismTests()
    {
        CliSandbox.CopyDirectory(TestFiles.Fixture("harbor"), _box.PathOf("harbor"));
        CliSandbox.CopyDirectory(TestFiles.Fixture("scripts"), _box.PathOf("scripts"));
    }

    public void Dispose() => _box.Dispose();

    private static readonly string[] Accept = ["accept", "scripts", "--golden", "golden", "--row-limit", "50"];
    private static readonly string[] Report = ["run", "scripts", "--golden", "golden", "--out", "reports", "--row-limit", "50"];

    /// <summary>Accepts and reports in-process under <paramref name="culture"/>; returns every file written.</summary>
    private SortedDictionary<string, byte[]> InProcess(string culture)
    {
        var saved = (CultureInfo.CurrentCulture, CultureInfo.CurrentUICulture);
        try
        {
            CultureInfo.CurrentCulture = CultureInfo.GetCultureInfo(culture);
            CultureInfo.CurrentUICulture = CultureInfo.GetCultureInfo(culture);
            Clean();
            var accept = _box.Cli(Accept);
            Assert.True(accept.Exit == 0, accept.Err);
            var run = _box.Cli(Report);
            Assert.True(run.Exit == 0, run.Err + run.Out);
            return Collect(run.Out);
        }
        finally
        {
            (CultureInfo.CurrentCulture, CultureInfo.CurrentUICulture) = saved;
        }
    }

    private SortedDictionary<string, byte[]> Child(Dictionary<string, string> env)
    {
        Clean();
        var accept = _box.Child(env, Accept);
        Assert.True(accept.Exit == 0, accept.Err);
        var run = _box.Child(env, Report);
        Assert.True(run.Exit == 0, run.Err + run.Out);
        return Collect(run.Out);
    }

    private void Clean()
    {
        foreach (var d in new[] { "golden", "reports" })
            if (Directory.Exists(_box.PathOf(d))) Directory.Delete(_box.PathOf(d), recursive: true);
    }

    private SortedDictionary<string, byte[]> Collect(string summary)
    {
        var files = new SortedDictionary<string, byte[]>(StringComparer.Ordinal);
        foreach (var (k, v) in _box.Files("golden")) files["golden/" + k] = v;
        foreach (var (k, v) in _box.Files("reports")) files["reports/" + k] = v;
        files["terminal summary"] = Encoding.UTF8.GetBytes(summary);
        return files;
    }

    private static void AssertSame(SortedDictionary<string, byte[]> expected, SortedDictionary<string, byte[]> actual, string what)
    {
        Assert.Equal(expected.Keys, actual.Keys);
        foreach (var (name, bytes) in expected)
            Assert.True(bytes.AsSpan().SequenceEqual(actual[name]), what + ": " + name + " differs");
    }

    [Fact]
    public void Golden_files_and_reports_are_byte_identical_across_runs_and_cultures()
    {
        var baseline = InProcess("en-US");
        Assert.Contains("reports/report.json", baseline.Keys);
        Assert.Contains(baseline.Keys, k => k.EndsWith(".arrow", StringComparison.Ordinal)); // frames above the row limit
        AssertSame(baseline, InProcess("en-US"), "second run");
        foreach (var culture in new[] { "de-DE", "tr-TR", "ar-SA" })
            AssertSame(baseline, InProcess(culture), culture);
    }

    [Fact]
    public void Golden_files_and_reports_are_byte_identical_across_time_zones_and_locales()
    {
        var baseline = InProcess("en-US");
        // Half-hour and quarter-hour offsets catch code that formats or parses in local time.
        AssertSame(baseline, Child(new() { ["TZ"] = "America/St_Johns", ["LANG"] = "de_DE.UTF-8", ["LC_ALL"] = "de_DE.UTF-8" }), "St John's");
        AssertSame(baseline, Child(new() { ["TZ"] = "Asia/Kathmandu", ["LANG"] = "tr_TR.UTF-8", ["LC_ALL"] = "tr_TR.UTF-8" }), "Kathmandu");
    }

    [Fact]
    public void Both_string_storages_give_the_same_rows_where_the_spec_says_they_agree()
    {
        // Spec §2.2: length counts code points in every mode; string order is code point order in every mode;
        // §2.3 distinct, join and grouping are the same in every mode. Missing values use null in both modes
        // compared here (boxed+null+cow against arrow+null+cow), so only the storage differs.
        _box.Write("scripts/strings.parity", """
            load tickets from '../harbor/tickets.csv'
            let shaped = tickets add n = length(passenger), up = upper(passenger), low = lower(passenger), \
                part = substring(passenger, 2, 3), swapped = replace(passenger, 'a', 'ä'), joined = passenger || '/' || note, \
                has = contains(passenger, 'ö'), starts = starts_with(passenger, 'M') \
                select ticket_id, passenger, n, up, low, part, swapped, joined, has, starts order by passenger, ticket_id
            check shaped
            let per_name = tickets group by passenger compute sold = count(), first_note = first(note) order by passenger
            check per_name
            let names = tickets distinct passenger select passenger order by passenger desc
            let matched = names join tickets on passenger select passenger, ticket_id order by ticket_id
            check matched
            """);
        foreach (var label in new[] { "shaped", "per_name", "matched" })
        {
            var boxed = _box.Cli("show", "scripts/strings.parity", "--checkpoint", label, "--mode", "boxed+null+cow", "--json");
            var arrow = _box.Cli("show", "scripts/strings.parity", "--checkpoint", label, "--mode", "arrow+null+cow", "--json");
            Assert.True(boxed.Exit == 0, boxed.Err);
            Assert.True(arrow.Exit == 0, arrow.Err);
            using var b = JsonDocument.Parse(boxed.Out);
            using var a = JsonDocument.Parse(arrow.Out);
            var rowsB = b.RootElement.GetProperty("rows").GetRawText();
            var rowsA = a.RootElement.GetProperty("rows").GetRawText();
            Assert.True(b.RootElement.GetProperty("rows").GetArrayLength() > 0, label + " has rows");
            Assert.Equal(rowsB, rowsA);
        }
    }
}
