namespace Parity.Script.Syntax;

public enum JoinKind
{
    Inner,
    Left,
}
