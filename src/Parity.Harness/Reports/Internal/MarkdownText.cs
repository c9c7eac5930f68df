using System.Text;

namespace Parity.Harness.Reports.Internal;

/// <summary>
/// Escaping for GitHub-flavoured Markdown. Data never goes into code spans (a backtick in the data could
/// close one); instead every character Markdown could read as syntax is escaped: <c>&amp;</c>, <c>&lt;</c>,
/// <c>&gt;</c> as HTML entities (so no tag or entity can form), the other ASCII punctuation that starts
/// emphasis, links, code, headings, tables, strikethrough or math with a backslash (CommonMark "Backslash
/// escapes"), control characters and line separators as visible <c>\n</c>/<c>\u{X}</c> text (so a value
/// never breaks a table row), and a second space in a run as <c>&amp;nbsp;</c> (so spacing survives).
/// </summary>
internal static class MarkdownText
{
    public static string Inline(string? s)
    {
        var visible = SafeText.Visible(s);
        var sb = new StringBuilder(visible.Length + 8);
        var previousSpace = false;
        foreach (var c in visible)
        {
            switch (c)
            {
                case '&': sb.Append("&amp;"); break;
                case '<': sb.Append("&lt;"); break;
                case '>': sb.Append("&gt;"); break;
                case ' ': sb.Append(previousSpace ? "&nbsp;" : " "); break;
                case '\\' or '`' or '*' or '_' or '[' or ']' or '#' or '|' or '!' or '~' or '$' or '(' or ')' or '{' or '}' or ':':
                    sb.Append('\\').Append(c);
                    break;
                default: sb.Append(c); break;
            }
            previousSpace = c == ' ';
        }
        // A trailing or leading space would be trimmed in a table cell; keep it visible.
        if (sb.Length > 0 && sb[^1] == ' ') { sb.Length--; sb.Append("&nbsp;"); }
        if (sb.Length > 0 && sb[0] == ' ') { sb.Remove(0, 1); sb.Insert(0, "&nbsp;"); }
        return sb.ToString();
    }

    /// <summary>
    /// A fenced code block for multi-line text (golden excerpts): the fence is one backtick longer than any
    /// backtick run inside, so nothing in the text can close it (CommonMark "Fenced code blocks"); control
    /// characters other than line feeds are made visible.
    /// </summary>
    public static string Fenced(string? text, string info)
    {
        var lines = (text ?? "").Replace("\r\n", "\n", StringComparison.Ordinal).Split('\n');
        var longest = 0;
        var run = 0;
        foreach (var c in text ?? "")
        {
            run = c == '`' ? run + 1 : 0;
            if (run > longest) longest = run;
        }
        var fence = new string('`', Math.Max(3, longest + 1));
        var sb = new StringBuilder();
        sb.Append(fence).Append(info).Append('\n');
        foreach (var line in lines)
            sb.Append(SafeText.Visible(line)).Append('\n');
        sb.Append(fence).Append('\n');
        return sb.ToString();
    }
}
