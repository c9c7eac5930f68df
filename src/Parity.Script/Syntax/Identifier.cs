using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>A frame or column name as written (quotes removed); names are case-sensitive.</summary>
public sealed record Identifier(string Name, SourceSpan Span) : Node(Span)
{
    public override string ToString() => Name;
}
