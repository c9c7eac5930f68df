namespace Parity.Engine.Columns;

/// <summary>The physical type of a column; its label is what spec §2.1 shows.</summary>
public enum ColumnType : byte
{
    Int64,
    Float64,
    Bool,
    Timestamp,

    /// <summary>An Arrow UTF-8 string array (<c>arrow</c> storage).</summary>
    Utf8,

    /// <summary>Boxed cells in an object array: boxed strings, mixed values, or bools with NaN.</summary>
    Object,
}
