using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record AppendClause(Identifier Other, SourceSpan Span) : Clause(Span);
