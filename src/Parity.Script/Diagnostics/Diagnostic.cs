using System.Globalization;

namespace Parity.Script.Diagnostics;

/// <summary>A located message with a stable code; one canonical text form.</summary>
public sealed record Diagnostic(string Code, string Message, string File, SourceSpan Span, Severity Severity = Severity.Error)
{
    /// <summary><c>file:line:col: error CODE: message</c>, positions 1-based.</summary>
    public string Format() =>
        File + ":" + Span.LineNumber.ToString(CultureInfo.InvariantCulture) + ":" + Span.ColumnNumber.ToString(CultureInfo.InvariantCulture)
        + ": " + (Severity == Severity.Error ? "error" : "warning") + " " + Code + ": " + Message;

    public override string ToString() => Format();
}
