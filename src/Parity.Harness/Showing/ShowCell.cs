using System.Text;
using Parity.Engine.Values;
using Parity.Harness.Reports.Internal;

namespace Parity.Harness.Showing;

/// <summary>
/// The text of one cell in the <c>show</c> table. PENDING: switches to the gate's shared cell text when
/// that lands; until then the same rules: strings quoted with <c>'</c> doubled, missing markers bare, a
/// non-finite float value prefixed <c>float:</c>, control characters escaped.
/// </summary>
internal static class ShowCell
{
    public static string Display(Value v) => v.Kind switch
    {
        ValueKind.Missing => ValueText.MissingName(v.Missing),
        ValueKind.String => Quote(v.String),
        ValueKind.Float64 => double.IsFinite(v.Float64) ? ValueText.FormatFloat(v.Float64) : "float:" + ValueText.FormatFloat(v.Float64),
        _ => ValueText.Format(v),
    };

    public static string Safe(string s) => SafeText.Visible(s);

    private static string Quote(string s)
    {
        var sb = new StringBuilder(s.Length + 2);
        sb.Append('\'');
        SafeText.AppendVisible(sb, s.Replace("\\", "\\\\", StringComparison.Ordinal).Replace("'", "''", StringComparison.Ordinal));
        sb.Append('\'');
        return sb.ToString();
    }
}
