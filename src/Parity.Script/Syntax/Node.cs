using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>Every syntax node knows where it starts in the script (for diagnostics).</summary>
public abstract record Node(SourceSpan Span);
