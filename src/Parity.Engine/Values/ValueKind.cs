namespace Parity.Engine.Values;

/// <summary>The kind of one cell's value.</summary>
public enum ValueKind : byte
{
    Missing,
    Int64,
    Float64,
    Bool,
    String,
    Timestamp,
}
