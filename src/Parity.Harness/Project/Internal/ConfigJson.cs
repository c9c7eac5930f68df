using System.Globalization;
using System.Text;
using System.Text.Json;
using Parity.Engine.Errors;

namespace Parity.Harness.Project.Internal;

/// <summary>
/// Reads the project file into <see cref="ConfigNode"/>s with positions: JSON (RFC 8259) with <c>//</c> and
/// <c>/* */</c> comments and trailing commas allowed. A syntax error, a duplicate key or nesting deeper than
/// the file needs is reported as <c>file:line:col: error E-CONFIG: ...</c>.
/// </summary>
internal static class ConfigJson
{
    private const int MaxDepth = 16;

    public static ConfigNode Parse(byte[] bytes, string display)
    {
        var start = bytes.AsSpan().StartsWith("\uFEFF"u8) ? 3 : 0;
        var data = bytes.AsMemory(start);
        if (data.Span.Trim(" \t\r\n"u8).IsEmpty) throw Fail(display, 1, 1, "the file is empty; write {} for a project with no settings");
        var lines = new LineMap(data.Span);
        var reader = new Utf8JsonReader(data.Span, new JsonReaderOptions
        {
            CommentHandling = JsonCommentHandling.Skip,
            AllowTrailingCommas = true,
            MaxDepth = MaxDepth,
        });
        try
        {
            // The reader itself rejects text after the first value ("not valid JSON" at that place).
            if (!reader.Read()) throw Fail(display, 1, 1, "the file holds only comments; write {} for a project with no settings");
            var root = ReadValue(ref reader, lines, display);
            while (reader.Read())
            {
            }
            return root;
        }
        catch (JsonException e)
        {
            // The reader's positions are 0-based (line, byte in line); ours are 1-based and count characters.
            var line = (int)(e.LineNumber ?? 0) + 1;
            var col = lines.ColumnOfByte(line, (int)(e.BytePositionInLine ?? 0));
            throw Fail(display, line, col, "not valid JSON: " + FirstSentence(e.Message));
        }
    }

    public static EngineException Fail(string display, int line, int column, string message) =>
        new(ErrorCodes.Config, message, display, line, column);

    private static ConfigNode ReadValue(ref Utf8JsonReader reader, LineMap lines, string display)
    {
        var (line, col) = lines.Position(reader.TokenStartIndex);
        switch (reader.TokenType)
        {
            case JsonTokenType.StartObject:
            {
                var node = new ConfigNode { Kind = ConfigNodeKind.Object, Line = line, Column = col };
                var seen = new HashSet<string>(StringComparer.Ordinal);
                while (reader.Read() && reader.TokenType != JsonTokenType.EndObject)
                {
                    var (kl, kc) = lines.Position(reader.TokenStartIndex);
                    var name = reader.GetString() ?? "";
                    if (!seen.Add(name)) throw Fail(display, kl, kc, "key '" + Formatting.CellText.Safe(name) + "' is given twice");
                    reader.Read();
                    node.Members.Add((name, kl, kc, ReadValue(ref reader, lines, display)));
                }
                return node;
            }
            case JsonTokenType.StartArray:
            {
                var node = new ConfigNode { Kind = ConfigNodeKind.Array, Line = line, Column = col };
                while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
                    node.Items.Add(ReadValue(ref reader, lines, display));
                return node;
            }
            case JsonTokenType.String:
                return new ConfigNode { Kind = ConfigNodeKind.String, Line = line, Column = col, Text = reader.GetString() };
            case JsonTokenType.Number:
            {
                var raw = Encoding.UTF8.GetString(reader.ValueSpan);
                var value = double.Parse(raw, NumberStyles.Float, CultureInfo.InvariantCulture);
                return new ConfigNode { Kind = ConfigNodeKind.Number, Line = line, Column = col, Number = value, RawNumber = raw };
            }
            case JsonTokenType.True:
            case JsonTokenType.False:
                return new ConfigNode { Kind = ConfigNodeKind.Bool, Line = line, Column = col, Bool = reader.TokenType == JsonTokenType.True };
            default:
                return new ConfigNode { Kind = ConfigNodeKind.Null, Line = line, Column = col };
        }
    }

    private static string FirstSentence(string message)
    {
        var cut = message.IndexOf(" LineNumber:", StringComparison.Ordinal);
        var text = (cut >= 0 ? message[..cut] : message).Trim();
        return text.EndsWith('.') ? text[..^1] : text;
    }

    /// <summary>Byte offsets to 1-based line and column (columns count Unicode scalar values, as editors do).</summary>
    private sealed class LineMap
    {
        private readonly List<int> _starts = [0];
        private readonly byte[] _bytes;

        public LineMap(ReadOnlySpan<byte> bytes)
        {
            _bytes = bytes.ToArray();
            for (var i = 0; i < bytes.Length; i++)
                if (bytes[i] == (byte)'\n') _starts.Add(i + 1);
        }

        public (int Line, int Column) Position(long offset)
        {
            var o = (int)Math.Min(offset, _bytes.Length);
            var index = _starts.BinarySearch(o);
            if (index < 0) index = ~index - 1;
            return (index + 1, Characters(_starts[index], o) + 1);
        }

        public int ColumnOfByte(int line, int byteInLine)
        {
            if (line < 1 || line > _starts.Count) return 1;
            var start = _starts[line - 1];
            return Characters(start, Math.Min(start + byteInLine, _bytes.Length)) + 1;
        }

        private int Characters(int from, int to)
        {
            var n = 0;
            for (var i = from; i < to; i++)
                if ((_bytes[i] & 0xC0) != 0x80) n++; // count lead bytes only
            return n;
        }
    }
}
