namespace Parity.Engine.IO.Internal.ParquetPages;

/// <summary>
/// What the string page decoder needs of a Parquet <c>PageHeader</c> (Parquet format, "parquet.thrift"):
/// the page type and sizes, and from whichever of the data page (v1 or v2) or dictionary page headers is present,
/// the value count, the encodings and, for v2, the sizes of the uncompressed level sections.
/// </summary>
internal readonly record struct ParquetPageHeader(
    ParquetPageType Type,
    int UncompressedSize,
    int CompressedSize,
    int ValueCount,
    int Encoding,
    int DefinitionEncoding,
    int DefinitionBytes,
    int RepetitionBytes,
    bool IsCompressed)
{
    /// <summary>Reads one header at the start of <paramref name="bytes"/>; <paramref name="length"/> is its size.</summary>
    public static ParquetPageHeader Read(ReadOnlySpan<byte> bytes, out int length)
    {
        var r = new ThriftCompactReader(bytes);
        int type = -1, uncompressed = -1, compressed = -1, values = -1, encoding = -1, defEncoding = 3, defBytes = 0, repBytes = 0;
        var isCompressed = true;
        short id = 0;
        while (true)
        {
            var (next, t) = r.ReadFieldHeader(id);
            if (t == ThriftCompactReader.Stop) break;
            id = next;
            switch (id)
            {
                case 1 when t == ThriftCompactReader.I32: type = r.ReadI32(); break;
                case 2 when t == ThriftCompactReader.I32: uncompressed = r.ReadI32(); break;
                case 3 when t == ThriftCompactReader.I32: compressed = r.ReadI32(); break;
                case 5 or 7 or 8 when t == ThriftCompactReader.Struct:
                {
                    // data_page_header (5), dictionary_page_header (7), data_page_header_v2 (8): field ids differ.
                    var v2 = id == 8;
                    short inner = 0;
                    while (true)
                    {
                        var (fid, ft) = r.ReadFieldHeader(inner);
                        if (ft == ThriftCompactReader.Stop) break;
                        inner = fid;
                        if (ft == ThriftCompactReader.I32)
                        {
                            var v = r.ReadI32();
                            switch (fid)
                            {
                                case 1: values = v; break;
                                case 2 when !v2: encoding = v; break;
                                case 3 when id == 5: defEncoding = v; break;
                                case 4 when v2: encoding = v; break;
                                case 5 when v2: defBytes = v; break;
                                case 6 when v2: repBytes = v; break;
                            }
                        }
                        else if (v2 && fid == 7 && ft is ThriftCompactReader.BoolTrue or ThriftCompactReader.BoolFalse)
                        {
                            isCompressed = ft == ThriftCompactReader.BoolTrue;
                        }
                        else
                        {
                            r.Skip(ft);
                        }
                    }
                    break;
                }
                default:
                    r.Skip(t);
                    break;
            }
        }
        length = r.Position;
        if (type < 0 || uncompressed < 0 || compressed < 0)
            throw new InvalidDataException("corrupt page header: type or sizes missing");
        var pageType = (ParquetPageType)type;
        if (pageType is ParquetPageType.Data or ParquetPageType.Dictionary or ParquetPageType.DataV2 && (values < 0 || encoding < 0))
            throw new InvalidDataException("corrupt page header: value count or encoding missing");
        if (defBytes < 0 || repBytes < 0 || (long)defBytes + repBytes > compressed)
            throw new InvalidDataException("corrupt page header: level sections larger than the page");
        return new ParquetPageHeader(pageType, uncompressed, compressed, values, encoding, defEncoding, defBytes, repBytes, isCompressed);
    }
}
