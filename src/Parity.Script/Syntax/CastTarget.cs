namespace Parity.Script.Syntax;

public enum CastTarget
{
    Int64,
    Float64,
    Bool,
    String,
    Timestamp,
}
