using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record ColumnClause(Identifier Column, SourceSpan Span) : Clause(Span);
