using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record AddClause(IReadOnlyList<NamedExpr> Items, SourceSpan Span) : Clause(Span);
