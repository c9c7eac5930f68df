using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>A source frame followed by clauses applied left to right.</summary>
public sealed record Derivation(Identifier Source, IReadOnlyList<Clause> Clauses, SourceSpan Span) : Node(Span);
