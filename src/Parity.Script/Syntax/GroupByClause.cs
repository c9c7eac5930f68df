using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record GroupByClause(IReadOnlyList<Identifier> Keys, IReadOnlyList<NamedExpr> Computes, SourceSpan Span) : Clause(Span);
