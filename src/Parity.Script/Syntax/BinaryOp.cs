namespace Parity.Script.Syntax;

/// <summary>Binary operators, loosest first: <c>or</c>; <c>and</c>; comparisons; <c>||</c>; <c>+ -</c>; <c>* / %</c>.</summary>
public enum BinaryOp
{
    Or,
    And,
    Eq,
    Ne,
    Lt,
    Le,
    Gt,
    Ge,
    Concat,
    Add,
    Sub,
    Mul,
    Div,
    Mod,
}
