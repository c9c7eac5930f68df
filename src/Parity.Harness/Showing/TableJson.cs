using System.Text.Json;
using Parity.Engine.Frames;
using Parity.Engine.Values;
using Parity.Harness.Reports.Internal;

namespace Parity.Harness.Showing;

/// <summary>
/// The JSON of <c>show --json</c> (spec §4): <c>{"label", "mode", "columns": [{"name", "type"}], "rows":
/// [[cell, ...], ...]}</c>. A cell is a JSON number (int64 exactly; a finite float in shortest round-trip
/// form, so <c>3.0</c> prints as <c>3</c>: the column type says float64), a string, a boolean, a timestamp
/// as an ISO 8601 string with <c>Z</c>, <c>{"missing": "NaN"|"None"|"null"|"NaT"}</c> for a missing value,
/// or <c>{"float": "NaN"|"Infinity"|"-Infinity"}</c> for a non-finite float that is a value.
/// </summary>
public static class TableJson
{
    /// <summary>
    /// Writes compact JSON and a final newline. The output is a standalone document, so non-ASCII text is
    /// kept readable (relaxed escaping); it must not be pasted into HTML as is.
    /// </summary>
    public static void Write(string label, string mode, Table table, Stream output)
    {
        var options = new JsonWriterOptions { Encoder = ReadableJsonEncoder.Instance, Indented = false };
        using (var w = new Utf8JsonWriter(output, options))
        {
            w.WriteStartObject();
            w.WriteString("label", JsonText.Clean(label));
            w.WriteString("mode", mode);
            w.WriteStartArray("columns");
            for (var c = 0; c < table.ColumnCount; c++)
            {
                w.WriteStartObject();
                w.WriteString("name", JsonText.Clean(table.Names[c]));
                w.WriteString("type", table.Columns[c].TypeLabel);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteStartArray("rows");
            for (var r = 0; r < table.RowCount; r++)
            {
                w.WriteStartArray();
                for (var c = 0; c < table.ColumnCount; c++)
                    WriteCell(w, table.Columns[c].GetValue(r));
                w.WriteEndArray();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        output.WriteByte((byte)'\n');
    }

    public static string ToJson(string label, string mode, Table table)
    {
        using var stream = new MemoryStream();
        Write(label, mode, table, stream);
        return System.Text.Encoding.UTF8.GetString(stream.ToArray());
    }

    internal static void WriteCell(Utf8JsonWriter w, Value v)
    {
        switch (v.Kind)
        {
            case ValueKind.Missing:
                w.WriteStartObject();
                w.WriteString("missing", ValueText.MissingName(v.Missing));
                w.WriteEndObject();
                break;
            case ValueKind.Int64:
                w.WriteNumberValue(v.Int64);
                break;
            case ValueKind.Float64:
                if (double.IsFinite(v.Float64))
                {
                    w.WriteNumberValue(v.Float64);
                }
                else
                {
                    w.WriteStartObject();
                    w.WriteString("float", ValueText.FormatFloat(v.Float64));
                    w.WriteEndObject();
                }
                break;
            case ValueKind.Bool:
                w.WriteBooleanValue(v.Bool);
                break;
            case ValueKind.Timestamp:
                w.WriteStringValue(ValueText.FormatTimestamp(v.TimestampMicros));
                break;
            default:
                w.WriteStringValue(JsonText.Clean(v.String));
                break;
        }
    }
}
