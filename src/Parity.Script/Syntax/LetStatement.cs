using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary><c>let NAME = DERIVATION</c>.</summary>
public sealed record LetStatement(Identifier Name, Derivation Value, SourceSpan Span) : Statement(Span);
