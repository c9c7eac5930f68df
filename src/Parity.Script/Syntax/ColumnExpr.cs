using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record ColumnExpr(Identifier Name, SourceSpan Span) : Expr(Span);
