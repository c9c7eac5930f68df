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
            WriteMismatch(w, m);
        w.WriteEndArray();
        w.WriteEndObject();
    }

    /// <summary>Most changes listed per golden mismatch; the rest are counted in <c>truncated</c>.</summary>
    public const int MaxChanges = 1000;

    /// <summary>One entry of <c>golden_mismatches</c> (docs/reports.md): exact counts, the schema change, up to <see cref="MaxChanges"/> changes.</summary>
    private static void WriteMismatch(Utf8JsonWriter w, GoldenMismatch m)
    {
        w.WriteStartObject();
        w.WriteString("script", S(m.Script));
        w.WriteString("mode", S(m.Mode));
        if (m.Checkpoint is null) w.WriteNull("checkpoint");
        else w.WriteString("checkpoint", S(m.Checkpoint));
        w.WriteString("kind", S(m.Kind));
        Number(w, "rows_golden", m.RowsGolden);
        Number(w, "rows_now", m.RowsNow);
        w.WriteNumber("rows_added", m.RowsAdded);
        w.WriteNumber("rows_removed", m.RowsRemoved);
        w.WriteNumber("rows_changed", m.RowsChanged);
        w.WriteNumber("cells_changed", m.CellsChanged);
        w.WriteStartObject("columns");
        foreach (var (name, n) in m.Columns) w.WriteNumber(S(name), n);
        w.WriteEndObject();
        w.WriteStartObject("schema");
        Strings(w, "added", m.Schema.Added);
        Strings(w, "removed", m.Schema.Removed);
        w.WriteStartArray("retyped");
        foreach (var r in m.Schema.Retyped)
        {
            w.WriteStartObject();
            w.WriteString("column", S(r.Column));
            w.WriteString("golden", S(r.Golden));
            w.WriteString("now", S(r.Now));
            w.WriteEndObject();
        }
        w.WriteEndArray();
        Strings(w, "moved", m.Schema.Moved);
        w.WriteEndObject();
        w.WriteStartArray("changes");
        var listed = Math.Min(MaxChanges, m.Changes.Count);
        for (var i = 0; i < listed; i++)
        {
            var c = m.Changes[i];
            w.WriteStartObject();
            Number(w, "row_golden", c.RowGolden);
            Number(w, "row_now", c.RowNow);
            String(w, "column", c.Column);
            String(w, "golden", c.Golden);
            String(w, "now", c.Now);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteNumber("truncated", m.Truncated + (m.Changes.Count - listed));
        w.WriteEndObject();
    }

    private static void Number(Utf8JsonWriter w, string name, long? value)
    {
        if (value is { } v) w.WriteNumber(name, v);
        else w.WriteNull(name);
    }

    private static void String(Utf8JsonWriter w, string name, string? value)
    {
        if (value is null) w.WriteNull(name);
        else w.WriteString(name, S(value));
    }

    private static void Strings(Utf8JsonWriter w, string name, IReadOnlyList<string> values)
    {
        w.WriteStartArray(name);
        foreach (var v in values) w.WriteStringValue(S(v));
        w.WriteEndArray();
    }

    private static void WriteFinding(Utf8JsonWriter w, Finding f)
    {
        w.WriteStartObject();
        w.WriteString("kind", f.KindLabel);
        w.WriteString("script", S(f.Script));
        w.WriteNumber("line", f.Line);
        if (f.Checkpoint is null) w.WriteNull("checkpoint");
        else w.WriteString("checkpoint", S(f.Checkpoint));
        String(w, "statement", f.Checkpoint is null ? f.Statement : null);
        if (f.Column is null) w.WriteNull("column");
        else w.WriteString("column", S(f.Column));
        w.WriteString("difference", S(f.Difference));
        w.WriteNumber("count", f.Count);
        if (f.AcceptedCount is { } accepted) w.WriteNumber("accepted_count", accepted);
        else w.WriteNull("accepted_count");
        w.WriteString("status", ReportFacts.Label(f.Status));
        w.WriteString("message", S(f.Message));
        w.WriteString("hint", S(f.Hint));
        w.WriteString("key", S(f.Key));
        Strings(w, "also_at", f.AlsoAt);
        String(w, "caused_by", f.CausedBy);
        Number(w, "caused_by_line", f.CausedByLine);
        w.WriteStartArray("occurrences");
        foreach (var o in f.Occurrences)
        {
            w.WriteStartObject();
            w.WriteString("checkpoint", S(o.Checkpoint));
            w.WriteNumber("line", o.Line);
            w.WriteNumber("count", o.Count);
            w.WriteEndObject();
        }
        w.WriteEndArray();
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
