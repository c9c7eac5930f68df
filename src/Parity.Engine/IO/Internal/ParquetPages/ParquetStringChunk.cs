using System.Buffers;
using System.Buffers.Binary;
using System.IO.Compression;
using Parquet.Meta;

namespace Parity.Engine.IO.Internal.ParquetPages;

/// <summary>
/// Decodes one column chunk of a flat string column (BYTE_ARRAY) page by page straight into the Arrow layout,
/// without a managed object or a slice per value: Parquet.Net's own raw read costs about 190 ns a value on
/// this machine, this about a tenth of that. It covers what writers commonly produce (Parquet format: data
/// pages v1 and v2, PLAIN and dictionary encodings, RLE definition levels, uncompressed, Snappy, gzip, Brotli,
/// Zstandard and LZ4 raw); anything else reports <see cref="Outcome.Unsupported"/> before or while decoding and
/// the caller reads the column through Parquet.Net instead. Corrupt bytes throw <see cref="InvalidDataException"/>.
/// </summary>
internal static class ParquetStringChunk
{
    public enum Outcome
    {
        Done,
        Unsupported,
        TooLarge,
    }

    private const int EncodingPlain = 0;
    private const int EncodingPlainDictionary = 2;
    private const int EncodingRle = 3;
    private const int EncodingRleDictionary = 8;

    /// <summary>A page that claims to inflate past this and more than 1,100 times is left to Parquet.Net.</summary>
    private const int InflateAlwaysAllowed = 64 << 20;

    public static bool IsSupported(ColumnChunk chunk, int maxDef) =>
        maxDef <= 1
        && chunk.FilePath is null
        && chunk.CryptoMetadata is null
        && chunk.EncryptedColumnMetadata is null
        && chunk.MetaData is { Type: Parquet.Meta.Type.BYTE_ARRAY } m
        && m.Codec is CompressionCodec.UNCOMPRESSED or CompressionCodec.SNAPPY or CompressionCodec.GZIP
            or CompressionCodec.BROTLI or CompressionCodec.ZSTD or CompressionCodec.LZ4_RAW;

    /// <summary>Reads the chunk's bytes from the file and appends its <paramref name="rows"/> rows to the sink.</summary>
    public static Outcome Read(Stream stream, ColumnMetaData meta, int rows, int maxDef, ParquetUtf8Sink sink)
    {
        if (ParquetChunkCheck.Range(meta, stream.Length) is not var (start, size))
            throw new InvalidDataException("a column chunk lies outside the file");
        if (size > System.Array.MaxLength) return Outcome.Unsupported;
        var chunk = ArrayPool<byte>.Shared.Rent((int)size);
        try
        {
            stream.Position = start;
            stream.ReadExactly(chunk, 0, (int)size);
            return Decode(chunk, (int)size, meta.Codec, rows, maxDef, sink);
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(chunk);
        }
    }

    /// <summary>Decodes the pages in the first <paramref name="size"/> bytes of <paramref name="chunk"/>.</summary>
    public static Outcome Decode(byte[] chunk, int size, CompressionCodec codec, int rows, int maxDef, ParquetUtf8Sink sink)
    {
        using var decoder = new PageDecoder(chunk, size, codec, maxDef, sink);
        return decoder.Run(rows);
    }

    private sealed class PageDecoder(byte[] chunk, int size, CompressionCodec codec, int maxDef, ParquetUtf8Sink sink) : IDisposable
    {
        private byte[] _page = [];
        private byte[] _dictionary = [];
        private int[] _dictionaryOffsets = [];
        private int _dictionaryCount = -1;
        private int[] _levels = [];
        private int[] _indices = [];

        public Outcome Run(int rows)
        {
            var pos = 0;
            var done = 0;
            while (done < rows)
            {
                if (pos >= size) throw new InvalidDataException("a column chunk ends before all its rows");
                var h = ParquetPageHeader.Read(chunk.AsSpan(pos, size - pos), out var headerLength);
                pos += headerLength;
                if (h.CompressedSize > size - pos) throw new InvalidDataException("a page runs past its column chunk");
                var bodyStart = pos;
                pos += h.CompressedSize;
                if (h.Type == ParquetPageType.Index) continue;
                if (h.Type == ParquetPageType.Dictionary)
                {
                    if (h.Encoding is not (EncodingPlain or EncodingPlainDictionary)) return Outcome.Unsupported;
                    if (!Inflate(bodyStart, h.CompressedSize, h.UncompressedSize, out var dict)) return Outcome.Unsupported;
                    ReadDictionary(dict, h.ValueCount);
                    continue;
                }
                if (h.Type is not (ParquetPageType.Data or ParquetPageType.DataV2))
                    throw new InvalidDataException("unknown page type " + (int)h.Type);
                var count = h.ValueCount;
                if (count > rows - done) throw new InvalidDataException("a page holds more values than its row group has rows");
                ReadOnlySpan<byte> values;
                ReadOnlySpan<byte> levels;
                if (h.Type == ParquetPageType.Data)
                {
                    if (!Inflate(bodyStart, h.CompressedSize, h.UncompressedSize, out var page)) return Outcome.Unsupported;
                    levels = default;
                    if (maxDef > 0)
                    {
                        if (h.DefinitionEncoding != EncodingRle) return Outcome.Unsupported;
                        if (page.Length < 4) throw new InvalidDataException("a data page ends inside its definition levels");
                        var length = BinaryPrimitives.ReadInt32LittleEndian(page);
                        if (length < 0 || length > page.Length - 4) throw new InvalidDataException("definition levels run past their page");
                        levels = page.Slice(4, length);
                        page = page[(4 + length)..];
                    }
                    values = page;
                }
                else
                {
                    // Data page v2: the level sections come first and are never compressed.
                    levels = chunk.AsSpan(bodyStart, h.DefinitionBytes);
                    if (h.RepetitionBytes != 0) return Outcome.Unsupported;
                    var at = bodyStart + h.DefinitionBytes;
                    var length = h.CompressedSize - h.DefinitionBytes;
                    if (h.IsCompressed)
                    {
                        if (!Inflate(at, length, h.UncompressedSize - h.DefinitionBytes, out values)) return Outcome.Unsupported;
                    }
                    else
                    {
                        values = chunk.AsSpan(at, length);
                    }
                }
                var present = Levels(levels, count);
                var outcome = h.Encoding switch
                {
                    EncodingPlain => AppendPlain(values, count, present),
                    EncodingPlainDictionary or EncodingRleDictionary => AppendDictionary(values, count, present),
                    _ => Outcome.Unsupported,
                };
                if (outcome != Outcome.Done) return outcome;
                done += count;
            }
            return Outcome.Done;
        }

        /// <summary>Definition levels of a page into <see cref="_levels"/>; the number of present values.</summary>
        private int Levels(ReadOnlySpan<byte> encoded, int count)
        {
            if (maxDef == 0) return count;
            if (_levels.Length < count) _levels = new int[count];
            var levels = _levels.AsSpan(0, count);
            RleBitPackedDecoder.Decode(encoded, 1, levels);
            var present = 0;
            foreach (var l in levels) present += l;
            return present;
        }

        private bool IsPresent(int i) => maxDef == 0 || _levels[i] != 0;

        private Outcome AppendPlain(ReadOnlySpan<byte> data, int count, int present)
        {
            // PLAIN byte arrays: a 4-byte little-endian length, then the bytes. One pass checks and sizes, one copies.
            long total = 0;
            var p = 0;
            for (var k = 0; k < present; k++)
            {
                if (data.Length - p < 4) throw new InvalidDataException("a page ends inside a value's length");
                var length = BinaryPrimitives.ReadInt32LittleEndian(data[p..]);
                if (length < 0 || length > data.Length - p - 4) throw new InvalidDataException("a value runs past its page");
                total += length;
                p += 4 + length;
            }
            if (!sink.Reserve(total, count)) return Outcome.TooLarge;
            p = 0;
            for (var i = 0; i < count; i++)
            {
                if (!IsPresent(i))
                {
                    sink.AppendMissing();
                    continue;
                }
                var length = BinaryPrimitives.ReadInt32LittleEndian(data[p..]);
                sink.Append(data.Slice(p + 4, length));
                p += 4 + length;
            }
            return Outcome.Done;
        }

        private Outcome AppendDictionary(ReadOnlySpan<byte> data, int count, int present)
        {
            if (_dictionaryCount < 0) throw new InvalidDataException("a dictionary-encoded page comes without a dictionary");
            if (data.Length < 1) throw new InvalidDataException("a dictionary-encoded page has no bit width");
            if (_indices.Length < present) _indices = new int[present];
            var indices = _indices.AsSpan(0, present);
            RleBitPackedDecoder.Decode(data[1..], data[0], indices);
            var offsets = _dictionaryOffsets;
            long total = 0;
            foreach (var index in indices)
            {
                if ((uint)index >= (uint)_dictionaryCount) throw new InvalidDataException("a dictionary index past the dictionary");
                total += offsets[index + 1] - offsets[index];
            }
            if (!sink.Reserve(total, count)) return Outcome.TooLarge;
            var dictionary = _dictionary.AsSpan();
            var k = 0;
            for (var i = 0; i < count; i++)
            {
                if (!IsPresent(i))
                {
                    sink.AppendMissing();
                    continue;
                }
                var index = indices[k++];
                sink.Append(dictionary[offsets[index]..offsets[index + 1]]);
            }
            return Outcome.Done;
        }

        /// <summary>A dictionary page's PLAIN values, kept as one buffer (lengths dropped) and offsets.</summary>
        private void ReadDictionary(ReadOnlySpan<byte> data, int count)
        {
            if (count < 0 || count > data.Length / 4) throw new InvalidDataException("a dictionary counts more values than its page holds");
            _dictionary = new byte[data.Length];
            _dictionaryOffsets = new int[count + 1];
            var p = 0;
            var at = 0;
            for (var k = 0; k < count; k++)
            {
                if (data.Length - p < 4) throw new InvalidDataException("a dictionary ends inside a value's length");
                var length = BinaryPrimitives.ReadInt32LittleEndian(data[p..]);
                if (length < 0 || length > data.Length - p - 4) throw new InvalidDataException("a dictionary value runs past its page");
                data.Slice(p + 4, length).CopyTo(_dictionary.AsSpan(at));
                at += length;
                p += 4 + length;
                _dictionaryOffsets[k + 1] = at;
            }
            _dictionaryCount = count;
        }

        /// <summary>
        /// The page body decompressed with the chunk's codec; false (use Parquet.Net) for a page that claims an
        /// implausible size, so a tiny corrupt file cannot make us allocate gigabytes.
        /// </summary>
        private bool Inflate(int start, int length, int uncompressed, out ReadOnlySpan<byte> page)
        {
            var source = chunk.AsSpan(start, length);
            if (uncompressed < 0) throw new InvalidDataException("a negative page size");
            if (codec == CompressionCodec.UNCOMPRESSED)
            {
                if (uncompressed != length) throw new InvalidDataException("an uncompressed page whose sizes disagree");
                page = source;
                return true;
            }
            page = default;
            if (uncompressed > InflateAlwaysAllowed && uncompressed > 1100L * length) return false;
            if (_page.Length < uncompressed)
            {
                if (_page.Length > 0) ArrayPool<byte>.Shared.Return(_page);
                _page = ArrayPool<byte>.Shared.Rent(uncompressed);
            }
            var target = _page.AsSpan(0, uncompressed);
            var written = codec switch
            {
                CompressionCodec.SNAPPY => Snappier.Snappy.Decompress(source, target),
                CompressionCodec.ZSTD => Zstd(source, target),
                CompressionCodec.LZ4_RAW => K4os.Compression.LZ4.LZ4Codec.Decode(source, target),
                CompressionCodec.BROTLI => BrotliDecoder.TryDecompress(source, target, out var w) ? w : -1,
                CompressionCodec.GZIP => Gzip(start, length, target),
                _ => throw new InvalidDataException("unsupported codec"),
            };
            if (written != uncompressed) throw new InvalidDataException("a page decompresses to another size than its header says");
            page = target;
            return true;
        }

        private static int Zstd(ReadOnlySpan<byte> source, Span<byte> target)
        {
            using var z = new ZstdSharp.Decompressor();
            return z.Unwrap(source, target);
        }

        private int Gzip(int start, int length, Span<byte> target)
        {
            using var gz = new GZipStream(new MemoryStream(chunk, start, length, writable: false), CompressionMode.Decompress);
            var total = 0;
            int read;
            while (total < target.Length && (read = gz.Read(target[total..])) > 0) total += read;
            return total == target.Length && gz.Read(stackalloc byte[1]) == 0 ? total : -1;
        }

        public void Dispose()
        {
            if (_page.Length > 0) ArrayPool<byte>.Shared.Return(_page);
        }
    }
}
