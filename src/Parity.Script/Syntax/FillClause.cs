using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record FillClause(IReadOnlyList<NamedExpr> Items, SourceSpan Span) : Clause(Span);
