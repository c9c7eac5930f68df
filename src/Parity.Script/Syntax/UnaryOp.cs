namespace Parity.Script.Syntax;

public enum UnaryOp
{
    Negate,
    Not,
}
