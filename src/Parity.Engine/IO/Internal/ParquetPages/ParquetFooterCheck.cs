using System.Buffers.Binary;

namespace Parity.Engine.IO.Internal.ParquetPages;

/// <summary>
/// Checks that a Parquet file ends in a well-formed footer before Parquet.Net reads it (Parquet format, "File
/// Format": ... <c>FileMetaData</c> (Thrift compact), its 4-byte little-endian length, "PAR1"). Parquet.Net 6.1.0
/// can loop forever on some ill-formed footers (tests/Parity.Tests/Reliability/Cases/parquet-footer-hang.parquet);
/// walking the footer with our bounds-checked, depth-capped Thrift reader rejects those at once, in time
/// proportional to the footer's size. A footer that passes still opens under the loader's time budget.
/// </summary>
internal static class ParquetFooterCheck
{
    private const byte I32 = ThriftCompactReader.I32;
    private const byte I64 = ThriftCompactReader.I64;
    private const byte Binary = ThriftCompactReader.Binary;
    private const byte List = ThriftCompactReader.List;
    private const byte Struct = ThriftCompactReader.Struct;

    /// <summary>
    /// The types "parquet.thrift" gives the footer fields Parquet.Net reads to open a file and find its pages;
    /// a footer whose fields have other types (a mutation that turned a struct into an integer) made it loop.
    /// </summary>
    private static readonly Dictionary<(string Struct, short Field), (byte Type, string? Nested)> Shape = new()
    {
        [("FileMetaData", 1)] = (I32, null), // version
        [("FileMetaData", 2)] = (List, "SchemaElement"),
        [("FileMetaData", 3)] = (I64, null), // num_rows
        [("FileMetaData", 4)] = (List, "RowGroup"),
        [("SchemaElement", 1)] = (I32, null), // type
        [("SchemaElement", 2)] = (I32, null), // type_length
        [("SchemaElement", 3)] = (I32, null), // repetition_type
        [("SchemaElement", 4)] = (Binary, null), // name
        [("SchemaElement", 5)] = (I32, null), // num_children
        [("SchemaElement", 6)] = (I32, null), // converted_type
        [("SchemaElement", 10)] = (Struct, null), // logicalType
        [("RowGroup", 1)] = (List, "ColumnChunk"),
        [("RowGroup", 2)] = (I64, null), // total_byte_size
        [("RowGroup", 3)] = (I64, null), // num_rows
        [("ColumnChunk", 1)] = (Binary, null), // file_path
        [("ColumnChunk", 2)] = (I64, null), // file_offset
        [("ColumnChunk", 3)] = (Struct, "ColumnMetaData"),
        [("ColumnMetaData", 1)] = (I32, null), // type
        [("ColumnMetaData", 2)] = (List, null), // encodings
        [("ColumnMetaData", 3)] = (List, null), // path_in_schema
        [("ColumnMetaData", 4)] = (I32, null), // codec
        [("ColumnMetaData", 5)] = (I64, null), // num_values
        [("ColumnMetaData", 6)] = (I64, null), // total_uncompressed_size
        [("ColumnMetaData", 7)] = (I64, null), // total_compressed_size
        [("ColumnMetaData", 9)] = (I64, null), // data_page_offset
        [("ColumnMetaData", 10)] = (I64, null), // index_page_offset
        [("ColumnMetaData", 11)] = (I64, null), // dictionary_page_offset
    };

    /// <summary>Null when the footer is well-formed Thrift; otherwise what is wrong with it.</summary>
    public static string? Problem(Stream stream)
    {
        var length = stream.Length;
        if (length < 12) return "the file is too short for a Parquet header and footer";
        Span<byte> tail = stackalloc byte[8];
        stream.Position = length - 8;
        stream.ReadExactly(tail);
        if (!tail[4..].SequenceEqual("PAR1"u8)) return "the file does not end in the Parquet magic PAR1";
        var footerLength = BinaryPrimitives.ReadInt32LittleEndian(tail);
        if (footerLength <= 0 || footerLength > length - 12) return "the footer length points outside the file";
        var footer = new byte[footerLength];
        stream.Position = length - 8 - footerLength;
        stream.ReadExactly(footer);
        stream.Position = 0;
        try
        {
            var reader = new ThriftCompactReader(footer);
            reader.SkipStruct("FileMetaData", Shape);
            return null;
        }
        catch (InvalidDataException ex)
        {
            return "the footer is not well-formed: " + ex.Message;
        }
    }
}
