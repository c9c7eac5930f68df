using Parity.Harness.Storage;
using System.Text;
using System.Text.Json;
using Parity.Harness.Findings;
using Parity.Harness.Reports.Internal;

namespace Parity.Harness.Reports;

/// <summary>
/// <c>report.json</c>, versioned by <see cref="GateReport.FormatVersion"/> (spec §5). Field order is fixed
/// and the only field that may vary between two runs of the same input is <c>generated_at</c> (null unless
/// set). The file is a standalone document: non-ASCII text stays readable (relaxed escaping), so it must be
/// escaped again before being embedded in HTML.
/// </summary>
public sealed class JsonReportWriter : IReportWriter
{
    public string Format => "json";

    public string FileName => "report.json";

    public void Write(GateReport report, string outDir) => AtomicFile.WriteAllText(Path.Combine(outDir, FileName), Render(report));

    public string Render(GateReport report)
    {
        using var stream = new MemoryStream();
        var options = new JsonWriterOptions { Encoder = ReadableJsonEncoder.Instance, Indented = true };
        using (var w = new Utf8JsonWriter(stream, options))
        {
            w.WriteStartObject();
            w.WriteNumber("version", GateReport.FormatVersion);
            w.WriteString("command", S(report.Command));
            if (report.GeneratedAt is null) w.WriteNull("generated_at");
            else w.WriteString("generated_at", S(report.GeneratedAt));
            w.WriteBoolean("passed", !report.Failed);
            WriteCounts(w, ReportFacts.CountByKind(report));
            w.WriteStartArray("scripts");
            foreach (var script in report.Scripts)
                WriteScript(w, script);
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return Encoding.UTF8.GetString(stream.ToArray()) + "\n";
    }

    private static void WriteScript(Utf8JsonWriter w, ScriptResult script)
    {
        w.WriteStartObject();
        w.WriteString("script", S(script.Script));
        w.WriteBoolean("passed", !script.Failed);
        w.WriteStartArray("modes");
        foreach (var m in script.Modes) w.WriteStringValue(S(m));
        w.WriteEndArray();
        WriteCounts(w, ReportFacts.CountByKind(script));

        w.WriteStartArray("checkpoints");
        foreach (var c in script.Checkpoints)
        {
            w.WriteStartObject();
            w.WriteString("label", S(c.Label));
            w.WriteNumber("line", c.Line);
            w.WriteStartObject("modes");
            // Modes in the script's order first, then any others in ordinal order: stable output.
            foreach (var mode in OrderedModes(script.Modes, c.PerMode.Keys))
            {
                var shape = c.PerMode[mode];
                w.WriteStartObject(S(mode));
                w.WriteNumber("rows", shape.Rows);
                w.WriteStartArray("columns");
                foreach (var col in shape.Columns)
                {
                    w.WriteStartObject();
                    w.WriteString("name", S(col.Name));
                    w.WriteString("type", S(col.Type));
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndObject();
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("findings");
        foreach (var f in script.Findings)
            WriteFinding(w, f);
        w.WriteEndArray();

        w.WriteStartArray("golden_mismatches");
        foreach (var m in script.GoldenMismatches)
        {
            w.WriteStartObject();
            w.WriteString("script", S(m.Script));
            if (m.Checkpoint is null) w.WriteNull("checkpoint");
            else w.WriteString("checkpoint", S(m.Checkpoint));
            w.WriteString("mode", S(m.Mode));
            w.WriteString("message", S(m.Message));
            w.WriteString("excerpt", S(m.Excerpt));
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteEndObject();
    }

    private static void WriteFinding(Utf8JsonWriter w, Finding f)
    {
        w.WriteStartObject();
        w.WriteString("kind", f.KindLabel);
        w.WriteString("script", S(f.Script));
        w.WriteNumber("line", f.Line);
        if (f.Checkpoint is null) w.WriteNull("checkpoint");
        else w.WriteString("checkpoint", S(f.Checkpoint));
        if (f.Column is null) w.WriteNull("column");
        else w.WriteString("column", S(f.Column));
        w.WriteNumber("count", f.Count);
        if (f.AcceptedCount is { } accepted) w.WriteNumber("accepted_count", accepted);
        else w.WriteNull("accepted_count");
        w.WriteString("status", ReportFacts.Label(f.Status));
        w.WriteString("message", S(f.Message));
        w.WriteString("hint", S(f.Hint));
        w.WriteString("key", S(f.Key));
        w.WriteStartArray("modes");
        foreach (var m in f.Modes) w.WriteStringValue(S(m));
        w.WriteEndArray();
        w.WriteStartArray("samples");
        foreach (var sample in f.Samples)
        {
            w.WriteStartObject();
            if (sample.Row is { } row) w.WriteNumber("row", row);
            else w.WriteNull("row");
            w.WriteStartObject("values");
            for (var i = 0; i < f.Modes.Count; i++)
                w.WriteString(S(f.Modes[i]), S(ReportFacts.SampleValue(sample, i)));
            w.WriteEndObject();
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteEndObject();
    }

    private static void WriteCounts(Utf8JsonWriter w, int[] counts)
    {
        w.WriteStartObject("finding_counts");
        for (var i = 0; i < counts.Length; i++)
            w.WriteNumber(ReportFacts.Label(ReportFacts.Kinds[i]), counts[i]);
        w.WriteEndObject();
    }

    private static List<string> OrderedModes(IReadOnlyList<string> order, IEnumerable<string> keys)
    {
        var present = new HashSet<string>(keys, StringComparer.Ordinal);
        var result = new List<string>();
        foreach (var m in order)
            if (present.Remove(m)) result.Add(m);
        var rest = present.ToList();
        rest.Sort(StringComparer.Ordinal);
        result.AddRange(rest);
        return result;
    }

    private static string S(string? s) => JsonText.Clean(s);
}
