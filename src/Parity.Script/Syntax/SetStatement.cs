using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>
/// <c>set F.c = EXPR [where COND]</c> (<see cref="Frame"/> set) or the chained write
/// <c>set (DERIVATION).c = EXPR [where COND]</c> (<see cref="Chain"/> set). Exactly one of the two is set.
/// </summary>
public sealed record SetStatement(Identifier? Frame, Derivation? Chain, Identifier Column, Expr Value, Expr? Condition, SourceSpan Span)
    : Statement(Span)
{
    public bool IsChained => Chain is not null;
}
