using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record WhereClause(Expr Condition, SourceSpan Span) : Clause(Span);
