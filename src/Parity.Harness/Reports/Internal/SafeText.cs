using System.Globalization;
using System.Text;

namespace Parity.Harness.Reports.Internal;

/// <summary>
/// Makes untrusted text safe to show on one line: control characters, line and paragraph separators,
/// bidirectional controls and lone surrogates become visible escapes (<c>\n</c>, <c>\r</c>, <c>\t</c>,
/// otherwise <c>\u{XXXX}</c>); everything else, including non-ASCII letters and emoji, is kept.
/// The set matches the cell text of the golden store, so a value reads the same in every output.
/// </summary>
internal static class SafeText
{
    /// <summary>
    /// C0 and C1 controls, DEL, lone surrogates, U+2028/U+2029, and the bidirectional controls of Unicode
    /// Standard Annex #9 ("Explicit Directional Formatting"), which could reorder a shown line.
    /// </summary>
    public static bool NeedsEscape(char c) =>
        c < ' ' || (c >= '\u007F' && c <= '\u009F') || char.IsSurrogate(c)
        || c == '\u2028' || c == '\u2029' || (c >= '\u202A' && c <= '\u202E') || (c >= '\u2066' && c <= '\u2069')
        || c == '\u200E' || c == '\u200F' || c == '\u061C' || c == '\uFEFF';

    /// <summary>The text with every character of <see cref="NeedsEscape"/> replaced by a visible escape.</summary>
    public static string Visible(string? s)
    {
        if (string.IsNullOrEmpty(s)) return "";
        if (IsClean(s)) return s;
        var sb = new StringBuilder(s.Length + 8);
        AppendVisible(sb, s);
        return sb.ToString();
    }

    public static void AppendVisible(StringBuilder sb, string s)
    {
        for (var i = 0; i < s.Length; i++)
        {
            var c = s[i];
            if (char.IsHighSurrogate(c) && i + 1 < s.Length && char.IsLowSurrogate(s[i + 1]))
            {
                sb.Append(c).Append(s[i + 1]);
                i++;
                continue;
            }
            if (!NeedsEscape(c)) { sb.Append(c); continue; }
            switch (c)
            {
                case '\n': sb.Append("\\n"); break;
                case '\r': sb.Append("\\r"); break;
                case '\t': sb.Append("\\t"); break;
                default: sb.Append("\\u{").Append(((int)c).ToString("X4", CultureInfo.InvariantCulture)).Append('}'); break;
            }
        }
    }

    private static bool IsClean(string s)
    {
        for (var i = 0; i < s.Length; i++)
        {
            var c = s[i];
            if (char.IsHighSurrogate(c) && i + 1 < s.Length && char.IsLowSurrogate(s[i + 1])) { i++; continue; }
            if (NeedsEscape(c)) return false;
        }
        return true;
    }
}
