using Parquet.Meta;

namespace Parity.Engine.IO.Internal.ParquetPages;

/// <summary>
/// Walks the page headers of a column chunk before Parquet.Net decodes it: every header must be well-formed
/// Thrift (our bounds-checked reader), every page must lie inside the chunk, and the data pages must hold
/// exactly the chunk's rows. Parquet.Net 6.1.0 can spin for minutes and allocate gigabytes on a chunk whose
/// first header is garbage (long-mode Parquet fuzzer, seed 7331, input #41086); this rejects such a chunk in
/// time proportional to its number of pages, reading only the headers.
/// </summary>
internal static class ParquetChunkCheck
{
    /// <summary>
    /// Where a chunk's bytes are: from its dictionary page when it has one (some writers leave that offset 0 or
    /// past the data page, which means none), else from its first data page; null when that lies outside the file.
    /// </summary>
    public static (long Start, long Size)? Range(ColumnMetaData meta, long fileLength)
    {
        var start = meta.DictionaryPageOffset is > 0 and var d && d < meta.DataPageOffset ? d : meta.DataPageOffset;
        var size = meta.TotalCompressedSize;
        return start < 0 || size < 0 || start > fileLength || size > fileLength - start ? null : (start, size);
    }

    /// <summary>Headers are read in windows of this size, doubled while a header runs past the window.</summary>
    private const int Window = 4096;

    /// <summary>Null when the chunk's pages look sound; otherwise what is wrong.</summary>
    public static string? Problem(Stream stream, ColumnMetaData meta, long rows)
    {
        if (Range(meta, stream.Length) is not var (start, size)) return "a column chunk lies outside the file";
        var end = start + size;
        var pos = start;
        long values = 0;
        var buffer = new byte[Window];
        while (values < rows)
        {
            if (pos >= end) return "a column chunk ends before all its rows";
            var (header, length, problem) = ReadHeader(stream, pos, end, ref buffer);
            if (problem is not null) return problem;
            pos += length;
            if (header.CompressedSize > end - pos) return "a page runs past its column chunk";
            pos += header.CompressedSize;
            if (header.Type is ParquetPageType.Data or ParquetPageType.DataV2)
            {
                if (header.ValueCount > rows - values) return "a page holds more values than its row group has rows";
                values += header.ValueCount;
            }
            else if (header.Type is not (ParquetPageType.Dictionary or ParquetPageType.Index))
            {
                return "unknown page type " + (int)header.Type;
            }
        }
        return null;
    }

    private static (ParquetPageHeader Header, int Length, string? Problem) ReadHeader(Stream stream, long pos, long end, ref byte[] buffer)
    {
        while (true)
        {
            var available = (int)Math.Min(buffer.Length, end - pos);
            stream.Position = pos;
            stream.ReadExactly(buffer, 0, available);
            try
            {
                var header = ParquetPageHeader.Read(buffer.AsSpan(0, available), out var length);
                return (header, length, null);
            }
            catch (InvalidDataException ex)
            {
                // A header longer than the window (large statistics): read more, up to the chunk's end.
                if (available < buffer.Length || buffer.Length >= 1 << 24) return (default, 0, ex.Message);
                buffer = new byte[buffer.Length * 2];
            }
        }
    }
}
