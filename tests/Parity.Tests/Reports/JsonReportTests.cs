using System.Text.Json;
using Parity.Harness.Findings;
using Parity.Harness.Reports;

namespace Parity.Tests.Reports;

public sealed class JsonReportTests
{
    private static JsonElement Parse(GateReport report) => JsonDocument.Parse(new JsonReportWriter().Render(report)).RootElement.Clone();

    // Spec §5: versioned; every finding has kind, script, line, checkpoint, column, count, status, message, samples.
    [Fact]
    public void Every_finding_has_the_required_fields()
    {
        var root = Parse(ReportFixtures.Ordinary());
        Assert.Equal(GateReport.FormatVersion, root.GetProperty("version").GetInt32());
        Assert.Equal("run", root.GetProperty("command").GetString());
        Assert.Equal(JsonValueKind.Null, root.GetProperty("generated_at").ValueKind);
        Assert.False(root.GetProperty("passed").GetBoolean());
        var count = 0;
        foreach (var script in root.GetProperty("scripts").EnumerateArray())
        {
            Assert.Equal(JsonValueKind.String, script.GetProperty("script").ValueKind);
            Assert.Equal(JsonValueKind.Array, script.GetProperty("modes").ValueKind);
            foreach (var f in script.GetProperty("findings").EnumerateArray())
            {
                count++;
                foreach (var name in new[] { "kind", "script", "line", "checkpoint", "column", "count", "status", "message", "hint", "samples" })
                    Assert.True(f.TryGetProperty(name, out _), "finding lacks " + name);
                Assert.Contains(f.GetProperty("status").GetString(), new[] { "new", "accepted", "changed", "resolved" });
                Assert.Contains(f.GetProperty("kind").GetString(), new[] { "shape", "type", "value", "missing", "alias", "warning", "error" });
                Assert.Equal(JsonValueKind.Number, f.GetProperty("line").ValueKind);
                Assert.Equal(JsonValueKind.Number, f.GetProperty("count").ValueKind);
            }
        }
        Assert.Equal(4, count);
    }

    // Spec §5: a checkpoints list with label, line and, per mode, row count and column types.
    [Fact]
    public void Checkpoints_list_rows_and_column_types_per_mode()
    {
        var script = Parse(ReportFixtures.Ordinary()).GetProperty("scripts")[0];
        var adults = script.GetProperty("checkpoints")[0];
        Assert.Equal("adults", adults.GetProperty("label").GetString());
        Assert.Equal(4, adults.GetProperty("line").GetInt32());
        var legacy = adults.GetProperty("modes").GetProperty("legacy");
        var modern = adults.GetProperty("modes").GetProperty("modern");
        Assert.Equal(5, legacy.GetProperty("rows").GetInt32());
        Assert.Equal("float64", legacy.GetProperty("columns")[1].GetProperty("type").GetString());
        Assert.Equal("int64", modern.GetProperty("columns")[1].GetProperty("type").GetString());
        Assert.Equal("age", modern.GetProperty("columns")[1].GetProperty("name").GetString());
    }

    [Fact]
    public void Samples_map_each_mode_to_its_value_and_statement_findings_have_null_checkpoint()
    {
        var findings = Parse(ReportFixtures.Ordinary()).GetProperty("scripts")[0].GetProperty("findings");
        var missing = findings[1];
        Assert.Equal("accepted", missing.GetProperty("status").GetString());
        Assert.Equal(2, missing.GetProperty("accepted_count").GetInt32());
        var sample = missing.GetProperty("samples")[1];
        Assert.Equal(3, sample.GetProperty("row").GetInt32());
        Assert.Equal("NaN", sample.GetProperty("values").GetProperty("legacy").GetString());
        Assert.Equal("null", sample.GetProperty("values").GetProperty("modern").GetString());
        var alias = findings[2];
        Assert.Equal(JsonValueKind.Null, alias.GetProperty("checkpoint").ValueKind);
        Assert.Equal(JsonValueKind.Null, alias.GetProperty("column").ValueKind);
        Assert.Equal(JsonValueKind.Null, alias.GetProperty("samples")[0].GetProperty("row").ValueKind);
    }

    // Common practice, no source: JSON carries data exactly; a reader gets back every character.
    [Fact]
    public void Hostile_values_round_trip_exactly()
    {
        var root = Parse(ReportFixtures.Hostile());
        var findings = root.GetProperty("scripts")[0].GetProperty("findings");
        for (var i = 0; i < ReportFixtures.HostileTexts.Count; i++)
        {
            var value = ReportFixtures.HostileTexts[i];
            var f = findings[i];
            Assert.Equal("message " + value, f.GetProperty("message").GetString());
            Assert.Equal("hint " + value, f.GetProperty("hint").GetString());
            Assert.Equal("notes " + value, f.GetProperty("checkpoint").GetString());
            Assert.Equal("note " + value, f.GetProperty("column").GetString());
            Assert.Equal("'" + value + "'", f.GetProperty("samples")[0].GetProperty("values").GetProperty("legacy").GetString());
        }
        var mismatch = root.GetProperty("scripts")[0].GetProperty("golden_mismatches")[0];
        Assert.Equal(JsonValueKind.Null, mismatch.GetProperty("checkpoint").ValueKind);
        Assert.Equal("records", mismatch.GetProperty("kind").GetString());
        Assert.Contains(ReportFixtures.Control, mismatch.GetProperty("changes")[0].GetProperty("now").GetString(), StringComparison.Ordinal);
        var frame = root.GetProperty("scripts")[0].GetProperty("golden_mismatches")[1];
        Assert.Equal("'" + ReportFixtures.Control + "'", frame.GetProperty("changes")[0].GetProperty("now").GetString());
        Assert.Equal(1, frame.GetProperty("columns").GetProperty("note " + ReportFixtures.Pipe).GetInt32());
    }

    // RFC 8259 §7: control characters must be escaped inside strings.
    [Fact]
    public void Raw_control_characters_never_reach_the_file()
    {
        var text = new JsonReportWriter().Render(ReportFixtures.Hostile());
        foreach (var c in text)
            Assert.False(c < ' ' && c != '\n' && c != '\r' && c != ' ', "raw control character U+" + ((int)c).ToString("X4", System.Globalization.CultureInfo.InvariantCulture));
    }

    [Fact]
    public void Only_generated_at_varies()
    {
        var a = new JsonReportWriter().Render(ReportFixtures.Hostile());
        var b = new JsonReportWriter().Render(ReportFixtures.Hostile("2025-03-01T08:15:00Z"));
        Assert.Equal(a.Replace("\"generated_at\": null", "\"generated_at\": \"2025-03-01T08:15:00Z\"", StringComparison.Ordinal), b);
    }

    [Fact]
    public void Lone_surrogates_become_replacement_characters()
    {
        var report = ReportFixtures.Ordinary() with
        {
            Scripts = [ReportFixtures.Ordinary().Scripts[1] with { Script = "ferry/\uD800bad.parity" }],
        };
        var root = Parse(report);
        Assert.Equal("ferry/\uFFFDbad.parity", root.GetProperty("scripts")[0].GetProperty("script").GetString());
    }
}
