using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary><c>x is null</c> / <c>x is not null</c>: true for any kind of missing value in any mode.</summary>
public sealed record IsNullExpr(Expr Operand, bool Negated, SourceSpan Span) : Expr(Span);
