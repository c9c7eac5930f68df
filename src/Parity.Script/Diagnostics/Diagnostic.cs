using System.Globalization;
using Parity.Engine.Text;

namespace Parity.Script.Diagnostics;

/// <summary>A located message with a stable code; one canonical text form.</summary>
public sealed record Diagnostic(string Code, string Message, string File, SourceSpan Span, Severity Severity = Severity.Error)
{
    /// <summary><c>file:line:col: error CODE: message</c>, positions 1-based.</summary>
    public string Format() =>
        ControlEscape.Escape(File) + ":" + Span.LineNumber.ToString(CultureInfo.InvariantCulture) + ":" + Span.ColumnNumber.ToString(CultureInfo.InvariantCulture)
        + ": " + (Severity == Severity.Error ? "error" : "warning") + " " + Code + ": " + ControlEscape.Escape(Message);

    public override string ToString() => Format();
}
