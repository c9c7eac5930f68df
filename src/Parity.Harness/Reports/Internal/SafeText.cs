using Parity.Harness.Formatting;

namespace Parity.Harness.Reports.Internal;

/// <summary>
/// Makes untrusted text safe to show on one line, exactly as the shared cell text does (control characters,
/// line and paragraph separators, bidirectional controls and lone surrogates become <c>\n</c>, <c>\r</c>,
/// <c>\t</c> or <c>\u{X}</c>), so a value reads the same in the terminal, every report and the golden files.
/// </summary>
internal static class SafeText
{
    public static string Visible(string? s) => string.IsNullOrEmpty(s) ? "" : CellText.Safe(s);
}
