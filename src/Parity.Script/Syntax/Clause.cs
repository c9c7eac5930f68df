using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>One derivation clause (spec §3.2). <see cref="Node.Span"/> points at its keyword.</summary>
public abstract record Clause(SourceSpan Span) : Node(Span);
