using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>An expression (spec §3.4).</summary>
public abstract record Expr(SourceSpan Span) : Node(Span);
