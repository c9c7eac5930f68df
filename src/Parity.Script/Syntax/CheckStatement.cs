using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>
/// <c>check F [key c1, c2] [as 'label']</c>: a checkpoint, labelled by the frame's name unless given. Key
/// columns, when named, match the frame's rows to its golden snapshot (docs/golden-format.md, "Comparing").
/// </summary>
public sealed record CheckStatement(Identifier Frame, string? Label, SourceSpan Span) : Statement(Span)
{
    public string EffectiveLabel => Label ?? Frame.Name;

    /// <summary>The key columns, in the order written; empty when the checkpoint names none.</summary>
    public IReadOnlyList<Identifier> Keys { get; init; } = [];
}
