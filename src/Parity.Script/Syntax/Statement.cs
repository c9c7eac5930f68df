using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>One statement (one logical line) of a script.</summary>
public abstract record Statement(SourceSpan Span) : Node(Span)
{
    /// <summary>
    /// The statement's canonical text: its tokens joined by one space, keywords in lower case, comments,
    /// line continuations and spacing dropped. It identifies the statement across edits elsewhere in the
    /// script (docs/workflow.md, "Finding keys"); empty for statements built outside the parser.
    /// </summary>
    public string Canonical { get; init; } = "";

    /// <summary>The 0-based line of the statement's last token (a statement continued with <c>\</c> spans several lines).</summary>
    public int LastLine { get; init; } = -1;
}
