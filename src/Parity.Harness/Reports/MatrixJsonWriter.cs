using System.Text;
using System.Text.Json;
using Parity.Harness.Reports.Internal;
using Parity.Harness.Running;

namespace Parity.Harness.Reports;

/// <summary>
/// <c>parity matrix --json</c> and <c>matrix.json</c> (docs/reports.md, "Matrix JSON"): per script, each
/// legacy-vs-modern finding with its status, the pairs per axis that show it and its <c>causes</c>, the
/// minimal sets of axes whose flip alone reproduces it.
/// </summary>
public static class MatrixJsonWriter
{
    /// <summary>Version of the matrix JSON format.</summary>
    public const int FormatVersion = 1;

    public const string FileName = "matrix.json";

    public static string Render(IReadOnlyList<(string Script, IReadOnlyList<MatrixRow> Rows)> scripts)
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Encoder = ReadableJsonEncoder.Instance, Indented = true }))
        {
            w.WriteStartObject();
            w.WriteNumber("version", FormatVersion);
            w.WriteStartArray("axes");
            foreach (var a in AxisMatrix.Axes) w.WriteStringValue(a);
            w.WriteEndArray();
            w.WriteStartArray("scripts");
            foreach (var (script, rows) in scripts)
            {
                w.WriteStartObject();
                w.WriteString("script", JsonText.Clean(script));
                w.WriteStartArray("findings");
                foreach (var row in rows)
                {
                    var f = row.Finding;
                    w.WriteStartObject();
                    w.WriteString("kind", f.KindLabel);
                    w.WriteString("script", JsonText.Clean(f.Script));
                    w.WriteNumber("line", f.Line);
                    if (f.Checkpoint is null) w.WriteNull("checkpoint");
                    else w.WriteString("checkpoint", JsonText.Clean(f.Checkpoint));
                    if (f.Column is null) w.WriteNull("column");
                    else w.WriteString("column", JsonText.Clean(f.Column));
                    w.WriteNumber("count", f.Count);
                    w.WriteString("status", ReportFacts.Label(f.Status));
                    w.WriteString("message", JsonText.Clean(f.Message));
                    w.WriteString("key", JsonText.Clean(f.Key));
                    w.WriteStartObject("pairs");
                    for (var i = 0; i < AxisMatrix.Axes.Count; i++) w.WriteNumber(AxisMatrix.Axes[i], row.PairsPerAxis[i]);
                    w.WriteEndObject();
                    w.WriteStartArray("causes");
                    foreach (var cause in row.Causes)
                    {
                        w.WriteStartArray();
                        foreach (var axis in cause) w.WriteStringValue(axis);
                        w.WriteEndArray();
                    }
                    w.WriteEndArray();
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        return Encoding.UTF8.GetString(stream.ToArray()) + "\n";
    }
}
