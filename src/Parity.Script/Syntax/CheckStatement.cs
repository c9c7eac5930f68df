using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary><c>check F [as 'label']</c>: a checkpoint, labelled by the frame's name unless given.</summary>
public sealed record CheckStatement(Identifier Frame, string? Label, SourceSpan Span) : Statement(Span)
{
    public string EffectiveLabel => Label ?? Frame.Name;
}
