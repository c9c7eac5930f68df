using System.Text;
using Apache.Arrow;
using Parity.Engine.IO.Internal.ParquetPages;
using Parquet;
using CompressionCodec = Parquet.Meta.CompressionCodec;
using PageEncoding = Parquet.Meta.Encoding;
using Parquet.Schema;

namespace Parity.Tests.Engine.IO;

/// <summary>
/// Our string page decoder against two references: Parquet.Net's own decoding of files Parquet.Net wrote (every
/// codec it writes, plain and dictionary pages), and hand-built column chunks laid out by the Parquet format
/// specification ("parquet.thrift" page headers in the Thrift compact protocol, the RLE / bit-packing hybrid,
/// PLAIN byte arrays, data pages v1 and v2) for the shapes Parquet.Net does not write.
/// </summary>
public sealed class ParquetPageDecoderTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    [Theory]
    [InlineData(CompressionMethod.None)]
    [InlineData(CompressionMethod.Snappy)]
    [InlineData(CompressionMethod.Gzip)]
    [InlineData(CompressionMethod.Brotli)]
    [InlineData(CompressionMethod.Zstd)]
    [InlineData(CompressionMethod.Lz4Raw)]
    public async Task Files_written_by_parquet_net_decode_to_its_own_values(CompressionMethod codec)
    {
        // Parquet.Net 6.1 writes PLAIN pages with RLE levels here (seen in the chunk metadata); dictionary pages are
        // checked on the hand-built chunks below.
        var names = new[] { "Åsa Lindqvist", "Σοφία Παππά", "山田 花子", "Ola 🚢", "" };
        string?[] Group(int g, int count) => Enumerable.Range(0, count)
            .Select(i => i % 7 == 3 ? null : names[i % names.Length] + (i % 3 == 0 ? "" : " #" + (g * 100_000 + i)))
            .ToArray();
        var groups = new[] { Group(0, 3000), Group(1, 17), Group(2, 5000) };
        var path = _files.PathOf("codec.parquet");
        var field = new DataField<string>("passenger", true);
        await using (var fs = File.Create(path))
        {
            await using var w = await ParquetWriter.CreateAsync(new ParquetSchema(field), fs, new ParquetOptions { CompressionMethod = codec });
            foreach (var g in groups)
            {
                using var rg = w.CreateRowGroup();
                await rg.WriteAsync(field, g);
            }
        }
        await using var stream = File.OpenRead(path);
        await using var reader = await ParquetReader.CreateAsync(stream, leaveStreamOpen: true);
        var sink = new ParquetUtf8Sink(groups.Sum(g => g.Length));
        var expected = new List<string?>();
        for (var g = 0; g < reader.RowGroupCount; g++)
        {
            using var rg = reader.OpenRowGroupReader(g);
            var chunk = rg.RowGroup.Columns[0];
            Assert.True(ParquetStringChunk.IsSupported(chunk, reader.Schema.GetDataFields()[0].MaxDefinitionLevel));
            var outcome = ParquetStringChunk.Read(stream, chunk.MetaData!, (int)rg.RowCount, reader.Schema.GetDataFields()[0].MaxDefinitionLevel, sink);
            Assert.Equal(ParquetStringChunk.Outcome.Done, outcome);
            var values = new string?[rg.RowCount];
            await rg.ReadAsync(reader.Schema.GetDataFields()[0], values.AsMemory(), null);
            expected.AddRange(values);
        }
        Assert.Equal(-1, sink.FirstInvalidRow());
        AssertValues(expected, sink.Build());
    }

    [Fact]
    public void A_v1_page_with_bit_packed_levels_and_plain_values()
    {
        // Definition levels 1,0,1,1 bit-packed in one group (header 0x03, bits LSB first 0b1101), behind their
        // 4-byte length in a v1 page; PLAIN values each behind a 4-byte little-endian length.
        var body = Concat(Int32(2), [0x03, 0b1101], Plain("a", "ζ", ""));
        var chunk = Concat(DataPageV1(4, PageEncoding.PLAIN, body.Length), body);
        AssertValues(["a", null, "ζ", ""], Decode(chunk, 4, maxDef: 1));
    }

    [Fact]
    public void A_dictionary_and_a_v2_page_with_rle_runs()
    {
        // Dictionary page (PLAIN values), then a v2 data page: levels (uncompressed, no length) as RLE runs
        // 2 x 1, 1 x 0, 2 x 1; indices with bit width 1, bit-packed 1,0,1,1; values section not compressed.
        var dictionary = Plain("Pier 1", "Pier 2");
        byte[] levels = [4, 1, 2, 0, 4, 1];
        byte[] indices = [1, 0x03, 0b1101];
        var chunk = Concat(
            DictionaryPage(2, dictionary.Length), dictionary,
            DataPageV2(5, 1, PageEncoding.RLE_DICTIONARY, levels.Length, levels.Length + indices.Length), levels, indices);
        AssertValues(["Pier 2", "Pier 1", null, "Pier 2", "Pier 2"], Decode(chunk, 5, maxDef: 1));
    }

    [Fact]
    public void A_required_column_has_no_levels()
    {
        var body = Plain("x", "yy");
        AssertValues(["x", "yy"], Decode(Concat(DataPageV1(2, PageEncoding.PLAIN, body.Length), body), 2, maxDef: 0));
    }

    [Fact]
    public void Delta_encodings_are_left_to_parquet_net()
    {
        var body = Concat(Int32(2), [0x03, 0b11], [0, 0, 0, 0]);
        var chunk = Concat(DataPageV1(2, PageEncoding.DELTA_LENGTH_BYTE_ARRAY, body.Length), body);
        Assert.Equal(ParquetStringChunk.Outcome.Unsupported, ParquetStringChunk.Decode(chunk, chunk.Length, CompressionCodec.UNCOMPRESSED, 2, 1, new ParquetUtf8Sink(2)));
    }

    public static TheoryData<string, byte[]> CorruptChunks()
    {
        var plain = Plain("a", "b");
        var levels = Concat(Int32(2), [0x03, 0b11]);
        var good = Concat(levels, plain);
        var dictionary = Plain("only");
        return new TheoryData<string, byte[]>
        {
            { "header cut short", DataPageV1(2, PageEncoding.PLAIN, good.Length)[..5] },
            { "page past the chunk", Concat(DataPageV1(2, PageEncoding.PLAIN, good.Length + 10), good) },
            { "value length past the page", Concat(DataPageV1(2, PageEncoding.PLAIN, good.Length), levels, Int32(1), [(byte)'a'], Int32(99), [(byte)'b']) },
            { "levels length past the page", Concat(DataPageV1(2, PageEncoding.PLAIN, 6), Int32(500), [0x03, 0b11]) },
            { "levels end early", Concat(DataPageV1(2, PageEncoding.PLAIN, 5), Int32(1), [0x03]) },
            { "index past the dictionary", Concat(DictionaryPage(1, dictionary.Length), dictionary, DataPageV1(2, PageEncoding.RLE_DICTIONARY, levels.Length + 3), levels, [1, 0x03, 0b10]) },
            { "dictionary page missing", Concat(DataPageV1(2, PageEncoding.RLE_DICTIONARY, levels.Length + 3), levels, [1, 0x03, 0b00]) },
            { "more values than rows", Concat(DataPageV1(9, PageEncoding.PLAIN, good.Length), good) },
            { "chunk ends before the rows", Concat(DataPageV1(1, PageEncoding.PLAIN, 11), Int32(2), [0x03, 0b1], Int32(1), [(byte)'a']) },
        };
    }

    [Theory]
    [MemberData(nameof(CorruptChunks))]
    public void Corrupt_chunks_are_rejected(string what, byte[] chunk)
    {
        _ = what;
        Assert.Throws<InvalidDataException>(() => ParquetStringChunk.Decode(chunk, chunk.Length, CompressionCodec.UNCOMPRESSED, 2, 1, new ParquetUtf8Sink(2)));
    }

    [Fact]
    public void Mutated_chunks_end_in_a_result_or_invalid_data()
    {
        // Fixed seed: 3,000 chunks with one to four bytes changed, cut or grown, each decoded in both level modes.
        var dictionary = Plain("Pier 1", "Pier 2", "Σ");
        byte[] levels = [4, 1, 2, 0, 4, 1];
        byte[] indices = [2, 0x03, 0b10_01_10_01];
        var seeds = new[]
        {
            Concat(DictionaryPage(3, dictionary.Length), dictionary, DataPageV2(5, 1, PageEncoding.RLE_DICTIONARY, levels.Length, levels.Length + indices.Length), levels, indices),
            Concat(DataPageV1(4, PageEncoding.PLAIN, 25), Int32(2), [0x03, 0b1101], Plain("a", "ζ", "")),
        };
        var random = new Random(20261202);
        var outcomes = new int[4];
        for (var i = 0; i < 3000; i++)
        {
            var chunk = seeds[i % seeds.Length].ToList();
            for (var m = random.Next(1, 5); m > 0; m--)
            {
                var at = random.Next(chunk.Count);
                switch (random.Next(3))
                {
                    case 0: chunk[at] = (byte)random.Next(256); break;
                    case 1: chunk.RemoveRange(at, chunk.Count - at); break;
                    default: chunk.Insert(at, (byte)random.Next(256)); break;
                }
                if (chunk.Count == 0) chunk.Add(0);
            }
            var bytes = chunk.ToArray();
            try
            {
                var outcome = ParquetStringChunk.Decode(bytes, bytes.Length, CompressionCodec.UNCOMPRESSED, 5, i % 2, new ParquetUtf8Sink(5));
                outcomes[(int)outcome]++;
            }
            catch (InvalidDataException)
            {
                outcomes[3]++;
            }
        }
        Assert.Equal(3000, outcomes.Sum());
        Assert.True(outcomes[3] > 0 && outcomes[0] + outcomes[1] > 0, string.Join(",", outcomes));
    }

    private static StringArray Decode(byte[] chunk, int rows, int maxDef)
    {
        var sink = new ParquetUtf8Sink(rows);
        Assert.Equal(ParquetStringChunk.Outcome.Done, ParquetStringChunk.Decode(chunk, chunk.Length, CompressionCodec.UNCOMPRESSED, rows, maxDef, sink));
        return sink.Build();
    }

    private static void AssertValues(IReadOnlyList<string?> expected, StringArray actual)
    {
        Assert.Equal(expected.Count, actual.Length);
        for (var i = 0; i < expected.Count; i++)
        {
            if (expected[i] is null) Assert.True(actual.IsNull(i), "row " + i);
            else Assert.Equal(expected[i], actual.GetString(i));
        }
    }

    private static byte[] Plain(params string[] values) =>
        Concat(values.Select(v => Concat(Int32(Encoding.UTF8.GetByteCount(v)), Encoding.UTF8.GetBytes(v))).ToArray());

    private static byte[] Int32(int v) => BitConverter.GetBytes(v); // little-endian on every machine we run on

    private static byte[] Concat(params byte[][] parts) => parts.SelectMany(p => p).ToArray();

    // Thrift compact protocol: a field header is (id delta << 4) | type; i32 is a zigzag varint; 12 is a struct.
    private static byte[] DataPageV1(int values, PageEncoding encoding, int size) =>
        PageHeader(0, size, 5, [values, (int)encoding, (int)PageEncoding.RLE, (int)PageEncoding.RLE]);

    private static byte[] DictionaryPage(int values, int size) =>
        PageHeader(2, size, 7, [values, (int)PageEncoding.PLAIN]);

    private static byte[] DataPageV2(int values, int nulls, PageEncoding encoding, int levelBytes, int size)
    {
        var inner = new List<byte>();
        var last = 0;
        foreach (var (id, v) in new[] { (1, values), (2, nulls), (3, values), (4, (int)encoding), (5, levelBytes), (6, 0) })
            I32Field(inner, ref last, id, v);
        inner.Add(0x12); // field 7 (is_compressed), type 2 = boolean false
        return PageHeader(3, size, 8, null, inner);
    }

    private static byte[] PageHeader(int type, int size, int structId, int[]? fields, List<byte>? raw = null)
    {
        var b = new List<byte>();
        var last = 0;
        I32Field(b, ref last, 1, type);
        I32Field(b, ref last, 2, size);
        I32Field(b, ref last, 3, size);
        b.Add((byte)(((structId - last) << 4) | 12));
        var innerLast = 0;
        if (fields is not null)
            for (var i = 0; i < fields.Length; i++) I32Field(b, ref innerLast, i + 1, fields[i]);
        if (raw is not null) b.AddRange(raw);
        b.Add(0); // end of the inner struct
        b.Add(0); // end of the page header
        return b.ToArray();
    }

    private static void I32Field(List<byte> b, ref int last, int id, int value)
    {
        b.Add((byte)(((id - last) << 4) | 5));
        last = id;
        var z = (uint)((value << 1) ^ (value >> 31));
        while (z >= 0x80)
        {
            b.Add((byte)(z | 0x80));
            z >>= 7;
        }
        b.Add((byte)z);
    }
}
