using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

public sealed record RenameClause(IReadOnlyList<RenamePair> Pairs, SourceSpan Span) : Clause(Span);
