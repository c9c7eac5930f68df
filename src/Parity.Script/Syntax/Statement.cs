using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>One statement (one logical line) of a script.</summary>
public abstract record Statement(SourceSpan Span) : Node(Span);
