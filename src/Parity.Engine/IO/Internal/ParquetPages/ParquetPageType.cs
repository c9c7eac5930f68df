namespace Parity.Engine.IO.Internal.ParquetPages;

/// <summary>Parquet format, "parquet.thrift", enum <c>PageType</c>.</summary>
internal enum ParquetPageType
{
    Data = 0,
    Index = 1,
    Dictionary = 2,
    DataV2 = 3,
}
