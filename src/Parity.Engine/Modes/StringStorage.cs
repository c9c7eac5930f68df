namespace Parity.Engine.Modes;

/// <summary>How a string column is stored (spec §2, axis "strings").</summary>
public enum StringStorage
{
    /// <summary>One managed object per cell in an object array; may also hold numbers and booleans.</summary>
    Boxed,

    /// <summary>One Arrow UTF-8 array: offsets, data bytes, validity bitmap.</summary>
    Arrow,
}
