using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record UnaryExpr(UnaryOp Op, Expr Operand, SourceSpan Span) : Expr(Span);
