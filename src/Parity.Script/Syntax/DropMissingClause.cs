using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary><c>drop missing [c1, c2]</c>; an empty list means every column.</summary>
public sealed record DropMissingClause(IReadOnlyList<Identifier> Columns, SourceSpan Span) : Clause(Span);
