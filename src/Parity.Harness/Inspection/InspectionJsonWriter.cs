using System.Text;
using System.Text.Json;

namespace Parity.Harness.Inspection;

/// <summary>
/// <c>inspect --json</c> (spec §4): <c>{"rows", "columns": [{"name", "types": {MODE: TYPE}, "missing",
/// "bytes": {"boxed", "arrow"}}], "bytes": {"boxed", "arrow"}}</c>, keys in that order. The default encoder
/// escapes anything that is not plain ASCII text, so untrusted column names cannot break the document.
/// </summary>
public static class InspectionJsonWriter
{
    public static string ToJson(DataInspection inspection)
    {
        using var buffer = new MemoryStream();
        using (var w = new Utf8JsonWriter(buffer, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteNumber("rows", inspection.Rows);
            w.WriteStartArray("columns");
            foreach (var c in inspection.Columns)
            {
                w.WriteStartObject();
                w.WriteString("name", c.Name);
                w.WriteStartObject("types");
                foreach (var kv in c.Types) w.WriteString(kv.Key, kv.Value);
                w.WriteEndObject();
                w.WriteNumber("missing", c.Missing);
                WriteBytes(w, c.BytesBoxed, c.BytesArrow);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            WriteBytes(w, inspection.BytesBoxed, inspection.BytesArrow);
            w.WriteEndObject();
        }
        return Encoding.UTF8.GetString(buffer.ToArray());
    }

    public static void Write(DataInspection inspection, TextWriter output)
    {
        output.Write(ToJson(inspection));
        output.Write('\n');
    }

    private static void WriteBytes(Utf8JsonWriter w, long boxed, long arrow)
    {
        w.WriteStartObject("bytes");
        w.WriteNumber("boxed", boxed);
        w.WriteNumber("arrow", arrow);
        w.WriteEndObject();
    }
}
