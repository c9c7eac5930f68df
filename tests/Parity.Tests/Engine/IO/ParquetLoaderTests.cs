using Parity.Engine.Columns;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parquet;
using Parquet.Schema;

namespace Parity.Tests.Engine.IO;

public sealed class ParquetLoaderTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    [Fact]
    public async Task Reads_every_supported_type_with_nulls()
    {
        var path = _files.PathOf("t.parquet");
        var fLong = new DataField<long?>("l");
        var fInt = new DataField<int>("i");
        var fDouble = new DataField<double?>("d");
        var fFloat = new DataField<float>("f");
        var fBool = new DataField<bool?>("b");
        var fTime = new DateTimeDataField("t", DateTimeFormat.Timestamp, isAdjustedToUTC: true, unit: DateTimeTimeUnit.Micros, isNullable: true);
        var fText = new DataField<string>("s", true);
        var schema = new ParquetSchema(fLong, fInt, fDouble, fFloat, fBool, fTime, fText);
        var when = new DateTime(2026, 6, 1, 12, 0, 0, DateTimeKind.Utc).AddTicks(1230);
        await using (var fs = File.Create(path))
        {
            // Written by Parquet.Net, the reference library for the Parquet format here.
            {
                await using var w = await ParquetWriter.CreateAsync(schema, fs);
                using var rg = w.CreateRowGroup();
                await rg.WriteAsync<long>(fLong, new long?[] { 5, null, -7 }.AsMemory());
                await rg.WriteAsync<int>(fInt, new[] { 1, 2, int.MinValue }.AsMemory());
                await rg.WriteAsync<double>(fDouble, new double?[] { 0.25, null, double.NaN }.AsMemory());
                await rg.WriteAsync<float>(fFloat, new[] { 1.5f, 2f, -0.5f }.AsMemory());
                await rg.WriteAsync<bool>(fBool, new bool?[] { true, null, false }.AsMemory());
                await rg.WriteAsync<DateTime>(fTime, new DateTime?[] { when, null, DateTime.UnixEpoch }.AsMemory());
                await rg.WriteAsync(fText, new[] { "Ελένη", null!, "" });
            }
        }
        var t = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        Assert.Equal(["int64", "int64", "float64", "float64", "bool", "timestamp", "utf8"], t.Columns.Select(c => c.TypeLabel).ToArray());
        Assert.Equal(Value.Of(-7L), t["l"].GetValue(2));
        Assert.True(t["l"].IsMissing(1));
        Assert.Equal(Value.Of((long)int.MinValue), t["i"].GetValue(2)); // int32 widened
        Assert.Equal(Value.Of(-0.5), t["f"].GetValue(2)); // float widened exactly
        // Spec §2.1: under null a NaN read from the file is a value, distinct from the null beside it.
        Assert.False(t["d"].IsMissing(2));
        Assert.True(t["d"].IsMissing(1));
        Assert.Equal(ValueText.ToMicros(new DateTimeOffset(when)), t["t"].GetValue(0).TimestampMicros);
        Assert.Equal(0L, t["t"].GetValue(2).TimestampMicros);
        Assert.Equal("Ελένη", t["s"].GetValue(0).String);
        Assert.Equal("", t["s"].GetValue(2).String);
        Assert.True(t["s"].IsMissing(1));

        var legacy = DataLoader.Load(path, LoadOptions.Default, Mode.Legacy);
        Assert.Equal(["float64", "int64", "float64", "float64", "object", "timestamp", "object"], legacy.Columns.Select(c => c.TypeLabel).ToArray());
        Assert.True(legacy["d"].IsMissing(2)); // Spec §2.1: under nan the NaN is the missing sentinel
    }

    [Fact]
    public void Strings_land_in_one_contiguous_utf8_buffer()
    {
        var path = _files.PathOf("s.parquet");
        ModeConversionTests.WriteParquetStrings(path, ["ab", null, "ζ🦆"]);
        var col = (Utf8Column)DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["s"];
        // Apache Arrow columnar format, variable-size binary layout: offsets [0, 2, 2, 8].
        Assert.Equal(new[] { 0, 2, 2, 8 }, col.Offsets.ToArray());
        Assert.Equal("abζ🦆"u8.ToArray(), col.Data[..8].ToArray());
    }

    [Fact]
    public async Task Row_groups_are_concatenated_in_order()
    {
        var path = _files.PathOf("g.parquet");
        var fId = new DataField<long?>("id");
        var fText = new DataField<string>("s", true);
        await using (var fs = File.Create(path))
        {
            await using var w = await ParquetWriter.CreateAsync(new ParquetSchema(fId, fText), fs);
            for (var g = 0; g < 3; g++)
            {
                using var rg = w.CreateRowGroup();
                var ids = Enumerable.Range(0, 500).Select(i => i % 7 == 0 ? (long?)null : g * 1000L + i).ToArray();
                var texts = Enumerable.Range(0, 500).Select(i => i % 5 == 0 ? null! : $"g{g}-{i}-ü").ToArray();
                await rg.WriteAsync<long>(fId, ids.AsMemory());
                await rg.WriteAsync(fText, texts);
            }
        }
        var t = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        Assert.Equal(1500, t.RowCount);
        Assert.Equal(Value.Of(2001L), t["id"].GetValue(1001));
        Assert.True(t["id"].IsMissing(1007));
        Assert.Equal("g2-499-ü", t["s"].GetValue(1499).String);
        Assert.True(t["s"].IsMissing(1005));
        Assert.Equal(3 * 100, t["s"].MissingCount);
    }

    [Fact]
    public void Harbor_sailings_fixture_loads()
    {
        var t = DataLoader.Load(TestFiles.Fixture("harbor/sailings.parquet"), LoadOptions.Default, Mode.Modern);
        Assert.Equal(["sailing_id", "route_id", "departs_at", "vessel", "capacity", "cancelled"], t.Names);
        Assert.Equal("int64", t["capacity"].TypeLabel);
        Assert.True(t["departs_at"].MissingCount > 0);
        Assert.Equal("object", DataLoader.Load(TestFiles.Fixture("harbor/sailings.parquet"), LoadOptions.Default, Mode.Legacy)["cancelled"].TypeLabel);
    }
}
