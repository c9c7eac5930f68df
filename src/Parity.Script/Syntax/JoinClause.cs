using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary><c>join other on k [= k2] [inner|left]</c>; <see cref="RightKey"/> is null when both keys share a name.</summary>
public sealed record JoinClause(Identifier Other, Identifier LeftKey, Identifier? RightKey, JoinKind Kind, SourceSpan Span) : Clause(Span);
