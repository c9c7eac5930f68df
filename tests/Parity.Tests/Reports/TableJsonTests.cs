using System.Text.Json;
using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Harness.Showing;

namespace Parity.Tests.Reports;

public sealed class TableJsonTests
{
    // Spec §4: {"label", "mode", "columns": [{"name", "type"}], "rows": [[cell, ...], ...]}.
    [Fact]
    public void Writes_the_exact_shape_of_spec_4()
    {
        var table = ShowTables.Build(Mode.Modern,
            ("passenger", ColumnType.Utf8, [Value.Of("Zo\u00EB"), Value.Null]),
            ("age", ColumnType.Int64, [Value.Of(31L), Value.Null]));
        Assert.Equal(
            "{\"label\":\"adults\",\"mode\":\"modern\",\"columns\":[{\"name\":\"passenger\",\"type\":\"utf8\"},{\"name\":\"age\",\"type\":\"int64\"}],"
            + "\"rows\":[[\"Zo\u00EB\",31],[{\"missing\":\"null\"},{\"missing\":\"null\"}]]}\n",
            TableJson.ToJson("adults", "modern", table));
    }

    // Spec §4: a missing value is {"missing": ...}; a non-finite float that is a value is {"float": ...};
    // IEEE 754: 0/0 is NaN, x/0 is ±Infinity. ISO 8601 timestamps with Z.
    [Fact]
    public void Cells_of_every_kind_under_modern()
    {
        var table = ShowTables.Build(Mode.Modern,
            ("fare", ColumnType.Float64, [Value.Of(12.5), Value.Of(double.NaN), Value.Of(double.PositiveInfinity), Value.Of(double.NegativeInfinity), Value.Null]),
            ("id", ColumnType.Int64, [Value.Of(long.MaxValue), Value.Of(-1L), Value.Of(0L), Value.Of(long.MinValue), Value.Null]),
            ("paid", ColumnType.Bool, [Value.Of(true), Value.Of(false), Value.Null, Value.Of(true), Value.Of(false)]),
            ("sailed", ColumnType.Timestamp, [Value.Timestamp(ShowTables.Micros(2024, 6, 1, 8, 30)), Value.Timestamp(ShowTables.Micros(2024, 6, 1, 8, 30) + 250_000), Value.Null, Value.Null, Value.Null]));
        using var doc = JsonDocument.Parse(TableJson.ToJson("sailings", "modern", table));
        var rows = doc.RootElement.GetProperty("rows");
        Assert.Equal(12.5, rows[0][0].GetDouble());
        Assert.Equal("NaN", rows[1][0].GetProperty("float").GetString());
        Assert.Equal("Infinity", rows[2][0].GetProperty("float").GetString());
        Assert.Equal("-Infinity", rows[3][0].GetProperty("float").GetString());
        Assert.Equal("null", rows[4][0].GetProperty("missing").GetString());
        Assert.Equal(long.MaxValue, rows[0][1].GetInt64()); // int64 as a JSON integer, exactly
        Assert.Equal(long.MinValue, rows[3][1].GetInt64());
        Assert.Equal(JsonValueKind.True, rows[0][2].ValueKind);
        Assert.Equal(JsonValueKind.False, rows[1][2].ValueKind);
        Assert.Equal("2024-06-01T08:30:00Z", rows[0][3].GetString());
        Assert.Equal("2024-06-01T08:30:00.25Z", rows[1][3].GetString());
        Assert.Equal("timestamp", doc.RootElement.GetProperty("columns")[3].GetProperty("type").GetString());
    }

    // Spec §2.1: under nan a missing float is NaN, a missing timestamp NaT, and boxed cells keep None apart.
    [Fact]
    public void Missing_markers_under_legacy()
    {
        var table = ShowTables.Build(Mode.Legacy,
            ("age", ColumnType.Float64, [Value.Of(31.0), Value.NaN]),
            ("note", ColumnType.Object, [Value.NoneRef, Value.NaN]),
            ("sailed", ColumnType.Timestamp, [Value.NaT, Value.Timestamp(0)]));
        using var doc = JsonDocument.Parse(TableJson.ToJson("tickets", "legacy", table));
        var rows = doc.RootElement.GetProperty("rows");
        Assert.Equal(31.0, rows[0][0].GetDouble());
        Assert.Equal("NaN", rows[1][0].GetProperty("missing").GetString());
        Assert.Equal("None", rows[0][1].GetProperty("missing").GetString());
        Assert.Equal("NaN", rows[1][1].GetProperty("missing").GetString());
        Assert.Equal("NaT", rows[0][2].GetProperty("missing").GetString());
        Assert.Equal("1970-01-01T00:00:00Z", rows[1][2].GetString());
        Assert.Equal("object", doc.RootElement.GetProperty("columns")[1].GetProperty("type").GetString());
    }

    // IEEE 754 / .NET round-trip formatting: the shortest text that reads back to the same double.
    [Theory]
    [InlineData(0.1)]
    [InlineData(1e20)]
    [InlineData(-0.000123)]
    [InlineData(3.0)]
    [InlineData(5e-324)]
    public void Floats_round_trip(double d)
    {
        var table = ShowTables.Build(Mode.Modern, ("x", ColumnType.Float64, [Value.Of(d)]));
        using var doc = JsonDocument.Parse(TableJson.ToJson("x", "modern", table));
        Assert.Equal(d, doc.RootElement.GetProperty("rows")[0][0].GetDouble());
    }

    // RFC 8259 §7: strings escape quotes, backslashes and control characters; everything else stays data.
    [Fact]
    public void Hostile_strings_stay_data_and_non_ascii_stays_readable()
    {
        var values = new[] { "<script>alert(1)</script>", "a\"b\\c", "line\nbreak\u0007", "para\u2028graph", "\u674E\u5C0F\u9F8D \U0001F6A2" };
        var table = ShowTables.Build(Mode.Modern, ("note", ColumnType.Utf8, values.Select(Value.Of).ToArray()));
        var json = TableJson.ToJson("notes", "arrow+null+cow", table);
        Assert.Contains("\u674E\u5C0F\u9F8D \U0001F6A2", json, StringComparison.Ordinal);
        Assert.Equal(1, json.Count(c => c == '\n'));
        using var doc = JsonDocument.Parse(json);
        Assert.Equal("arrow+null+cow", doc.RootElement.GetProperty("mode").GetString());
        var rows = doc.RootElement.GetProperty("rows");
        for (var i = 0; i < values.Length; i++)
            Assert.Equal(values[i], rows[i][0].GetString());
    }
}
