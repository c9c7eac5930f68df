using System.Runtime.InteropServices;
using Apache.Arrow;
using Apache.Arrow.Ipc;
using Apache.Arrow.Types;
using Parity.Engine.Columns;
using Parity.Engine.IO;
using Parity.Engine.IO.Internal;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Column = Parity.Engine.Columns.Column;
using Table = Parity.Engine.Frames.Table;

namespace Parity.Tests.Engine.IO;

public sealed class ArrowIpcTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    /// <summary>One string column named <c>name</c> in one batch, written by Apache.Arrow's own file writer.</summary>
    private string WriteStrings(string file, StringArray array, int length)
    {
        var batch = new RecordBatch(new Schema.Builder().Field(f => f.Name("name").DataType(StringType.Default)).Build(), [array], length);
        var path = _files.PathOf(file);
        using var fs = File.Create(path);
        using var w = new ArrowFileWriter(fs, batch.Schema);
        w.WriteRecordBatch(batch);
        w.WriteEnd();
        return path;
    }

    [Fact]
    public void Csv_strings_follow_the_arrow_utf8_layout()
    {
        var path = _files.Write("t.csv", "k,s\n0,ab\n1,\n2,ζ\n3,🦆\n4,x\n5,y\n6,z\n7,w\n8,\n9,last\n");
        var col = (Utf8Column)DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["s"];
        var n = col.Length;
        Assert.Equal(10, n);
        // Apache Arrow columnar format, "Variable-size Binary Layout": n+1 offsets, non-decreasing, the last
        // one the data length; a slot's bytes are data[offsets[i], offsets[i+1]).
        var offsets = col.Offsets;
        Assert.Equal(n + 1, offsets.Length);
        for (var i = 0; i < n; i++) Assert.True(offsets[i] <= offsets[i + 1]);
        Assert.Equal(0, offsets[0]);
        Assert.Equal(2 + 2 + 4 + 4 + 4, offsets[n]); // "ab", "ζ" (2 bytes), "🦆" (4), x y z w, "last"
        Assert.Equal(offsets[2], offsets[1]); // a null slot has length 0
        // "Validity bitmaps": bit i of byte i/8, least significant bit first; 1 = valid. Slots 1 and 8 are null.
        var bitmap = col.Array.NullBitmapBuffer.Span;
        Assert.Equal(0b1111_1101, bitmap[0]);
        Assert.Equal(0b10, bitmap[1] & 0b11);
        Assert.Equal(2, col.Array.NullCount); // "null count" equals the cleared bits
    }

    [Fact]
    public void Our_file_reads_back_with_apache_arrow_reader()
    {
        var table = SampleTable();
        var path = _files.PathOf("t.arrow");
        ArrowIpcWriter.Write(table, path);
        // Apache.Arrow's own ArrowFileReader is the reference for the IPC file format.
        using var stream = File.OpenRead(path);
        using var reader = new ArrowFileReader(stream);
        var batch = reader.ReadNextRecordBatch();
        Assert.Equal(3, batch.Length);
        Assert.Equal(new long?[] { 1, null, 3 }, ((Int64Array)batch.Column(0)).ToArray());
        var s = (StringArray)batch.Column(1);
        Assert.Equal("Zoë", s.GetString(0));
        Assert.True(s.IsNull(1));
        Assert.Equal("山田 🌊", s.GetString(2));
        var ts = (TimestampArray)batch.Column(2);
        Assert.Equal(TimeUnit.Microsecond, ((TimestampType)ts.Data.DataType).Unit);
        Assert.Equal(1_700_000_000_000_000L, ts.GetValue(0));
        Assert.Equal(new bool?[] { true, false, null }, ((BooleanArray)batch.Column(3)).ToArray());
        Assert.True(double.IsNaN(((DoubleArray)batch.Column(4)).GetValue(2)!.Value)); // a NaN value under null stays a value
        Assert.True(batch.Column(4).IsNull(1));
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Apache_arrow_files_and_streams_load(bool streamFormat)
    {
        var batch = Parity.Engine.IO.ArrowIpcWriter.ToRecordBatch(SampleTable());
        var path = _files.PathOf(streamFormat ? "t.arrows" : "t.arrow");
        using (var fs = File.Create(path))
        {
            // Written by Apache.Arrow's own writers (Arrow columnar format, "IPC Streaming Format" / "IPC File Format").
            using ArrowStreamWriter w = streamFormat ? new ArrowStreamWriter(fs, batch.Schema) : new ArrowFileWriter(fs, batch.Schema);
            w.WriteRecordBatch(batch);
            w.WriteEnd();
        }
        var back = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        AssertSameValues(SampleTable(), back);
    }

    [Fact]
    public void Round_trip_through_our_writer_keeps_values_and_types()
    {
        var path = _files.PathOf("t.arrow");
        ArrowIpcWriter.Write(SampleTable(), path);
        AssertSameValues(SampleTable(), DataLoader.Load(path, LoadOptions.Default, Mode.Modern));
    }

    [Fact]
    public void Mapped_strings_and_numbers_are_not_copied()
    {
        var path = _files.PathOf("t.arrow");
        ArrowIpcWriter.Write(SampleTable(), path);
        var t = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        var s = (Utf8Column)t["name"];
        Assert.True(MemoryMarshal.TryGetMemoryManager<byte, MappedMemory>(s.Array.ValueBuffer.Memory, out _));
        var ids = (Int64Column)t["id"];
        Assert.True(MemoryMarshal.TryGetMemoryManager<long, CastMemory<long>>(ids.Values, out _));
    }

    [Fact]
    public void A_table_of_millions_of_narrow_rows_is_written_as_one_mapped_batch()
    {
        // 4,200,000 rows once crossed a fixed 4,000,000-row batch size and the load had to copy both batches.
        const int n = 4_200_000;
        var ids = new long[n];
        for (var i = 0; i < n; i++) ids[i] = i;
        var path = _files.PathOf("big.arrow");
        ArrowIpcWriter.Write(new Table(["id"], [new Int64Column(ids, MissingMarker.Null)], n), path);
        var loaded = (Int64Column)DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["id"];
        Assert.True(MemoryMarshal.TryGetMemoryManager<long, CastMemory<long>>(loaded.Values, out _));
        Assert.Equal(n - 1, loaded.Span[n - 1]);
    }

    [Fact]
    public void Batches_are_cut_by_bytes_where_the_long_strings_are()
    {
        // 200,000 rows: the first 65,536 hold 1,000-byte strings, the rest one byte. With a 66 MB budget the
        // long block fills a batch of its own and the short rows share the next one.
        const int n = 200_000;
        var b = new Utf8ColumnBuilder(n, n * 2);
        var longText = new string('x', 1000);
        for (var i = 0; i < n; i++) b.Append(i < 65_536 ? longText : "y");
        var table = new Table(["s"], [b.Build(MissingMarker.Null)], n);
        Assert.Equal([0, n], ArrowIpcWriter.BatchBounds(table));
        Assert.Equal([0, 65_536, n], ArrowIpcWriter.BatchBounds(table, 66_000_000));
        var path = _files.PathOf("cut.arrow");
        ArrowIpcWriter.Write(table, path);
        Assert.Equal("y", DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["s"].GetValue(n - 1).String);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void A_large_buffer_is_checked_whole_when_split_across_cores(bool broken)
    {
        // 18 MB of ASCII (the ASCII test runs in parts from 16 MB) with one value near the end that is not ASCII:
        // U+00E9 (C3 A9) is valid UTF-8; a lone A9 is not (Unicode, UTF-8, Table 3-7).
        const int n = 600_000;
        var b = new Utf8ColumnBuilder(n, n * 30);
        var filler = new string('a', 30);
        for (var i = 0; i < n - 2; i++) b.Append(filler);
        b.Append(broken ? new byte[] { 0x41, 0xA9 } : "Aé"u8);
        b.Append("z");
        var path = _files.PathOf("large.arrow");
        ArrowIpcWriter.Write(new Table(["s"], [b.Build(MissingMarker.Null)], n), path);
        if (broken)
        {
            var ex = Assert.Throws<Parity.Engine.Errors.EngineException>(() => DataLoader.Load(path, LoadOptions.Default, Mode.Modern));
            Assert.Equal("E-UTF8", ex.Code);
            Assert.Equal(n - 1, ex.Row);
            return;
        }
        var s = DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["s"];
        Assert.Equal("Aé", s.GetValue(n - 2).String);
    }

    [Theory]
    [InlineData(new[] { 0, 2, 1, 3 }, 2)] // a decrease at offset 2
    [InlineData(new[] { 0, 1, -5, 3 }, 2)] // a negative offset: its difference from 1 must not pass as an increase
    [InlineData(new[] { 0, 1, 2, 9 }, 0)] // past the 3-byte data buffer: the message check finds it before any row is read
    [InlineData(new[] { 0, 1, 2, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 3, 2, 3, 3, 3, 3, 3 }, 14)] // inside the vectorised part
    public void Bad_string_offsets_are_located(int[] offsetValues, int row)
    {
        // Apache Arrow columnar format, "Variable-size Binary Layout": offsets are non-decreasing and within the data.
        var offsets = new ArrowBuffer(MemoryMarshal.AsBytes<int>(offsetValues).ToArray());
        var length = offsetValues.Length - 1;
        var array = new StringArray(length, offsets, new ArrowBuffer("abc"u8.ToArray()), ArrowBuffer.Empty, 0, 0);
        var path = WriteStrings("offsets.arrow", array, length);
        var ex = Assert.Throws<Parity.Engine.Errors.EngineException>(() => DataLoader.Load(path, LoadOptions.Default, Mode.Modern));
        Assert.Equal("E-ARROW", ex.Code);
        Assert.Equal(row, ex.Row);
    }

    [Fact]
    public void A_character_split_across_two_values_is_invalid_utf8()
    {
        // Unicode, UTF-8 (Table 3-7): U+00E9 is C3 A9. Stored as two values [C3] and [A9], the data buffer as
        // a whole is valid UTF-8 but each value is not (Apache Arrow columnar format: each utf8 value is UTF-8).
        var offsets = new ArrowBuffer(MemoryMarshal.AsBytes<int>(new[] { 0, 1, 2 }).ToArray());
        var data = new ArrowBuffer(new byte[] { 0xC3, 0xA9 });
        var array = new StringArray(2, offsets, data, ArrowBuffer.Empty, 0, 0);
        var path = WriteStrings("split.arrow", array, 2);
        var ex = Assert.Throws<Parity.Engine.Errors.EngineException>(() => DataLoader.Load(path, LoadOptions.Default, Mode.Modern));
        Assert.Equal("E-UTF8", ex.Code);
        Assert.Equal(2, ex.Row);
    }

    [Fact]
    public void Multiple_batches_concatenate()
    {
        var batch = ArrowIpcWriter.ToRecordBatch(SampleTable());
        var path = _files.PathOf("t.arrow");
        using (var fs = File.Create(path))
        {
            using var w = new ArrowFileWriter(fs, batch.Schema);
            w.WriteRecordBatch(batch);
            w.WriteRecordBatch(batch);
            w.WriteEnd();
        }
        var t = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        Assert.Equal(6, t.RowCount);
        Assert.Equal("山田 🌊", t["name"].GetValue(5).String);
        Assert.True(t["id"].IsMissing(4));
    }

    [Fact]
    public void Narrow_types_dictionaries_and_large_strings_decode()
    {
        var dictionary = new StringArray.Builder().Append("north").Append("south").Build();
        var indices = new Int32Array.Builder().Append(1).Append(0).AppendNull().Build();
        var dictType = new DictionaryType(Int32Type.Default, StringType.Default, false);
        var dict = new DictionaryArray(dictType, indices, dictionary);
        var large = new LargeStringArray.Builder().Append("λ").AppendNull().Append("").Build();
        var narrow = new Int32Array.Builder().Append(-5).Append(7).AppendNull().Build();
        var single = new FloatArray.Builder().Append(1.5f).AppendNull().Append(2f).Build();
        var schema = new Schema.Builder()
            .Field(f => f.Name("d").DataType(dictType))
            .Field(f => f.Name("l").DataType(LargeStringType.Default))
            .Field(f => f.Name("i").DataType(Int32Type.Default))
            .Field(f => f.Name("f").DataType(FloatType.Default))
            .Build();
        var batch = new RecordBatch(schema, [dict, large, narrow, single], 3);
        var path = _files.PathOf("t.arrow");
        using (var fs = File.Create(path))
        {
            using var w = new ArrowFileWriter(fs, schema);
            w.WriteRecordBatch(batch);
            w.WriteEnd();
        }
        var t = DataLoader.Load(path, LoadOptions.Default, Mode.Modern);
        Assert.Equal(["utf8", "utf8", "int64", "float64"], t.Columns.Select(c => c.TypeLabel).ToArray());
        Assert.Equal("south", t["d"].GetValue(0).String);
        Assert.True(t["d"].IsMissing(2));
        Assert.Equal("λ", t["l"].GetValue(0).String);
        Assert.Equal(-5L, t["i"].GetValue(0).Int64);
        Assert.Equal(1.5, t["f"].GetValue(0).Float64);
        // Spec §2.1: int with missing is float64 under nan.
        Assert.Equal("float64", DataLoader.Load(path, LoadOptions.Default, Mode.Legacy)["i"].TypeLabel);
    }

    [Fact]
    public void Mixed_object_columns_are_written_as_text_with_a_note()
    {
        var cells = new object?[] { "a", 1L, null };
        var table = new Table(["m"], [new ObjectColumn(cells, MissingMarker.Nan)], 3);
        var path = _files.PathOf("m.arrow");
        ArrowIpcWriter.Write(table, path);
        using var reader = new ArrowFileReader(File.OpenRead(path));
        var batch = reader.ReadNextRecordBatch();
        var field = reader.Schema.FieldsList[0];
        Assert.Equal("mixed", field.Metadata[ArrowIpcWriter.ObjectKey]);
        var s = (StringArray)batch.Column(0);
        Assert.Equal("1", s.GetString(1));
        Assert.True(s.IsNull(2));
    }

    private static Table SampleTable()
    {
        var names = new Utf8ColumnBuilder(3, 16);
        names.Append("Zoë");
        names.AppendMissing();
        names.Append("山田 🌊");
        Column[] columns =
        [
            new Int64Column(new long[] { 1, 0, 3 }, new Validity(new byte[] { 0b101 }, 0, 3), MissingMarker.Null),
            names.Build(MissingMarker.Null),
            new TimestampColumn(new long[] { 1_700_000_000_000_000L, 0, -1 }, Validity.AllValid(3), MissingMarker.Null),
            new BoolColumn(new[] { true, false, false }, new Validity(new byte[] { 0b011 }, 0, 3), MissingMarker.Null),
            new Float64Column(new[] { 0.5, 0, double.NaN }, new Validity(new byte[] { 0b101 }, 0, 3), MissingMarker.Null),
        ];
        return new Table(["id", "name", "at", "ok", "x"], columns, 3);
    }

    private static void AssertSameValues(Table expected, Table actual)
    {
        Assert.Equal(expected.Names, actual.Names);
        for (var c = 0; c < expected.ColumnCount; c++)
        {
            Assert.Equal(expected.Columns[c].Type, actual.Columns[c].Type);
            for (var r = 0; r < expected.RowCount; r++)
                Assert.Equal(expected.Columns[c].GetValue(r), actual.Columns[c].GetValue(r));
        }
    }
}
