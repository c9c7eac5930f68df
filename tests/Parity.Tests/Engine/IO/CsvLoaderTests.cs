using Parity.Engine.Columns;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.IO;

public sealed class CsvLoaderTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    [Fact]
    public void Reads_rfc4180_quoting_crlf_bom_and_embedded_line_breaks()
    {
        var t = DataLoader.Load(TestFiles.Fixture("data/rfc4180.csv"), LoadOptions.Default, Mode.Modern);
        // RFC 4180 §2: header line (rule 3), CRLF breaks (rule 1), quoted comma and line break (rule 6),
        // doubled quote inside a quoted field (rule 7); the UTF-8 byte order mark is not part of the first name.
        Assert.Equal(["id", "name", "remark", "price"], t.Names);
        Assert.Equal(3, t.RowCount);
        Assert.Equal("Lindqvist, Zoë", t["name"].GetValue(0).String);
        Assert.Equal("said \"hello\"", t["remark"].GetValue(0).String);
        Assert.Equal("two\r\nlines", t["remark"].GetValue(1).String);
        Assert.Equal("Ågren", t["name"].GetValue(1).String);
        // Spec §6: the empty field is missing; a quoted empty field is the same empty value (docs/data.md).
        Assert.True(t["name"].IsMissing(2));
        Assert.True(t["price"].IsMissing(2));
        Assert.Equal(ColumnType.Float64, t["price"].Type);
        Assert.Equal(ColumnType.Int64, t["id"].Type);
    }

    // RFC 4180 §2, the examples of rules 1-7 (with a header row, rule 3).
    [Theory]
    [InlineData("aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n", "zzz", "yyy")] // rule 1
    [InlineData("aaa,bbb,ccc\r\nzzz,yyy,xxx", "zzz", "yyy")] // rule 2: no break after the last record
    [InlineData("aaa,bbb,ccc\r\n zzz,yyy ,xxx\r\n", " zzz", "yyy ")] // rule 4: spaces are part of a field
    [InlineData("aaa,bbb,ccc\r\n\"zzz\",\"yyy\",xxx\r\n", "zzz", "yyy")] // rule 5
    [InlineData("aaa,bbb,ccc\r\n\"zzz\",\"y\r\nyy\",xxx\r\n", "zzz", "y\r\nyy")] // rule 6
    [InlineData("aaa,bbb,ccc\r\n\"z,z\",\"y\"\"yy\",xxx\r\n", "z,z", "y\"yy")] // rules 6 and 7
    public void Rfc4180_examples(string text, string first, string second)
    {
        var t = DataLoader.Load(_files.Write("r.csv", text), LoadOptions.Default, Mode.Legacy);
        Assert.Equal(["aaa", "bbb", "ccc"], t.Names);
        Assert.Equal(1, t.RowCount);
        Assert.Equal(first, t["aaa"].GetValue(0).String);
        Assert.Equal(second, t["bbb"].GetValue(0).String);
        Assert.Equal("xxx", t["ccc"].GetValue(0).String);
    }

    [Fact]
    public void Random_bytes_load_or_fail_with_a_located_error()
    {
        // Common practice, no source: a parser fed arbitrary input either succeeds or reports; it never crashes.
        byte[] alphabet = [(byte)'a', (byte)'1', (byte)',', (byte)'"', (byte)'\n', (byte)'\r', (byte)' ', 0xC3, 0xA9, 0xFF, (byte)'.', (byte)'-'];
        var rng = new Random(5);
        for (var k = 0; k < 300; k++)
        {
            var bytes = new byte[rng.Next(0, 40)];
            for (var i = 0; i < bytes.Length; i++) bytes[i] = alphabet[rng.Next(alphabet.Length)];
            var path = _files.WriteBytes("f" + k + ".csv", bytes);
            try
            {
                var t = DataLoader.Load(path, LoadOptions.Default, Mode.Legacy);
                for (var c = 0; c < t.ColumnCount; c++)
                    for (var r = 0; r < t.RowCount; r++) _ = t.Columns[c].GetValue(r);
            }
            catch (Parity.Engine.Errors.EngineException ex)
            {
                Assert.StartsWith("E-", ex.Code, StringComparison.Ordinal);
            }
        }
    }

    [Fact]
    public void Reads_a_configured_delimiter_and_missing_tokens()
    {
        var options = LoadOptions.Default with { Delimiter = ';', MissingTokens = ["", "n/a"] };
        var t = DataLoader.Load(TestFiles.Fixture("data/raw_semicolon.csv"), options, Mode.Modern);
        Assert.Equal(["ticket_id", "passenger", "age", "fare", "note"], t.Names);
        Assert.Equal(ColumnType.Int64, t["age"].Type); // Spec §2.1: int64 with nulls under null modes
        Assert.True(t["age"].IsMissing(1)); // 'n/a'
        Assert.True(t["age"].IsMissing(2)); // ''
        Assert.True(t["note"].IsMissing(0));
        Assert.Equal(-8.0, t["fare"].GetValue(2).Float64);
        Assert.Equal("Kai 🦆 Brontë", t["passenger"].GetValue(3).String);
    }

    [Fact]
    public void Only_the_configured_tokens_are_missing()
    {
        var path = _files.Write("t.csv", "a,b\nn/a,x\n,y\n");
        var t = DataLoader.Load(path, LoadOptions.Default with { MissingTokens = ["n/a"] }, Mode.Modern);
        Assert.True(t["a"].IsMissing(0));
        // Spec §6: "empty field is missing unless configured otherwise": here it is an empty string.
        Assert.False(t["a"].IsMissing(1));
        Assert.Equal("", t["a"].GetValue(1).String);
    }

    // Spec §6 inference order: int64, float64, bool, ISO 8601 timestamp, else string.
    [Theory]
    [InlineData("1|-2|+3", ColumnType.Int64)]
    [InlineData("1|2.5|3", ColumnType.Float64)]
    [InlineData("1e3|-0.5", ColumnType.Float64)]
    [InlineData("true|FALSE|True", ColumnType.Bool)]
    [InlineData("2026-05-01T10:00:00+02:00|2026-05-01 08:00Z|2026-05-01", ColumnType.Timestamp)]
    [InlineData("1|x", ColumnType.Utf8)]
    [InlineData("true|1", ColumnType.Utf8)]
    [InlineData("1|true", ColumnType.Utf8)]
    [InlineData("2026-05-01|1", ColumnType.Utf8)]
    [InlineData("9223372036854775808|1", ColumnType.Float64)] // above int64: only a float fits
    [InlineData("2026-13-01T00:00:00Z", ColumnType.Utf8)] // month 13 is no date (ISO 8601)
    [InlineData("ζ|🦆", ColumnType.Utf8)]
    public void Infers_types_in_order(string cells, ColumnType expected)
    {
        var path = _files.Write("t.csv", "c\n" + cells.Replace('|', '\n') + "\n");
        Assert.Equal(expected, DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["c"].Type);
    }

    [Fact]
    public void Ints_turn_float_when_a_later_value_needs_it()
    {
        var lines = Enumerable.Range(0, 300).Select(i => i == 7 ? "" : (i * 3).ToString(System.Globalization.CultureInfo.InvariantCulture)).Append("0.5");
        var path = _files.Write("t.csv", "a,k\n" + string.Join(",x\n", lines) + ",x\n");
        var col = DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["a"];
        Assert.Equal(ColumnType.Float64, col.Type);
        Assert.Equal(897.0, col.GetValue(299).Float64);
        Assert.True(col.IsMissing(7));
        Assert.Equal(0.5, col.GetValue(300).Float64);
    }

    [Fact]
    public void A_column_of_only_missing_cells_is_float64()
    {
        var path = _files.Write("t.csv", "a,b\n1,\n2,\n");
        var t = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        Assert.Equal(ColumnType.Float64, t["b"].Type);
        Assert.Equal(2, t["b"].MissingCount);
    }

    [Fact]
    public void Blank_lines_are_skipped()
    {
        var path = _files.Write("t.csv", "a,b\n\n1,2\n\n3,4\n");
        var t = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        Assert.Equal(2, t.RowCount);
        Assert.Equal(3L, t["a"].GetValue(1).Int64);
    }

    [Fact]
    public void Header_only_file_has_no_rows()
    {
        var path = _files.Write("t.csv", "a,b\n");
        var t = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        Assert.Equal(0, t.RowCount);
        Assert.Equal(2, t.ColumnCount);
    }

    // ISO 8601 (extended format): an offset is subtracted to give UTC; microseconds since the epoch.
    [Theory]
    [InlineData("2026-05-01T10:00:00+02:00", 2026, 5, 1, 8, 0, 0, 0)]
    [InlineData("2026-05-01T08:00:00Z", 2026, 5, 1, 8, 0, 0, 0)]
    [InlineData("2026-01-01T00:30:00-01:30", 2026, 1, 1, 2, 0, 0, 0)]
    [InlineData("2026-03-01T01:00:00+0200", 2026, 2, 28, 23, 0, 0, 0)]
    [InlineData("2024-02-29T23:59:59.123456+00", 2024, 2, 29, 23, 59, 59, 123456)]
    [InlineData("1969-12-31T23:59:59.5Z", 1969, 12, 31, 23, 59, 59, 500000)]
    [InlineData("2026-05-01", 2026, 5, 1, 0, 0, 0, 0)]
    public void Timestamps_with_offsets_are_normalised_to_utc(string text, int y, int mo, int d, int h, int mi, int s, int micros)
    {
        var path = _files.Write("t.csv", "t\n" + text + "\n");
        var col = DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["t"];
        Assert.Equal(ColumnType.Timestamp, col.Type);
        var expected = ValueText.ToMicros(new DateTimeOffset(y, mo, d, h, mi, s, TimeSpan.Zero)) + micros;
        Assert.Equal(expected, col.GetValue(0).TimestampMicros);
    }

    [Fact]
    public void Fields_longer_than_the_scratch_buffer_unescape()
    {
        var big = new string('x', 5000) + "\"\"" + new string('y', 5000);
        var path = _files.Write("t.csv", "a\n\"" + big + "\"\n");
        var value = DataLoader.Load(path, LoadOptions.Default, Mode.Legacy)["a"].GetValue(0).String;
        Assert.Equal(10001, value.Length);
        Assert.Equal('"', value[5000]);
    }
}
