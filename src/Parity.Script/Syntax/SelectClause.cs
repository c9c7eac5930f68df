using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record SelectClause(IReadOnlyList<Identifier> Columns, SourceSpan Span) : Clause(Span);
