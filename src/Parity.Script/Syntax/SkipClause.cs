using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record SkipClause(long Count, SourceSpan Span) : Clause(Span);
