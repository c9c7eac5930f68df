using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record CastClause(IReadOnlyList<CastItem> Items, SourceSpan Span) : Clause(Span);
