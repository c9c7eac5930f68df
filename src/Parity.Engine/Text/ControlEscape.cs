using System.Globalization;
using System.Text;

namespace Parity.Engine.Text;

/// <summary>
/// Makes a name or message safe to print on a terminal: control characters (C0 including newline and tab,
/// DEL, C1) and the line and paragraph separators become <c>\xNN</c> or <c>\u{NNNN}</c>, so a file name
/// holding an escape sequence cannot clear the screen or forge a line (docs/reliability.md, "Terminal safety").
/// A string without such characters comes back as it is.
/// </summary>
public static class ControlEscape
{
    public static string Escape(string? text)
    {
        if (string.IsNullOrEmpty(text)) return text ?? "";
        var i = 0;
        while (i < text.Length && !Needs(text[i])) i++;
        if (i == text.Length) return text;
        var sb = new StringBuilder(text.Length + 8);
        sb.Append(text, 0, i);
        for (; i < text.Length; i++)
        {
            var c = text[i];
            if (!Needs(c)) sb.Append(c);
            else if (c < 0x100) sb.Append("\\x").Append(((int)c).ToString("X2", CultureInfo.InvariantCulture));
            else sb.Append("\\u{").Append(((int)c).ToString("X4", CultureInfo.InvariantCulture)).Append('}');
        }
        return sb.ToString();
    }

    private static bool Needs(char c) => c < 0x20 || c is >= '\u007f' and <= '\u009f' || c is '\u2028' or '\u2029';
}
