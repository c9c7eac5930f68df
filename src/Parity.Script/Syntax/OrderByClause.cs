using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record OrderByClause(IReadOnlyList<OrderKey> Keys, SourceSpan Span) : Clause(Span);
