using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record TakeClause(long Count, SourceSpan Span) : Clause(Span);
