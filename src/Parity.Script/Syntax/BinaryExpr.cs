using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record BinaryExpr(BinaryOp Op, Expr Left, Expr Right, SourceSpan Span) : Expr(Span);
