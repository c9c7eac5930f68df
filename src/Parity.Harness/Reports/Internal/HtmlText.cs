using System.Text;

namespace Parity.Harness.Reports.Internal;

/// <summary>
/// HTML escaping for text content and quoted attribute values: <c>&amp; &lt; &gt; " '</c> become
/// entities, control characters and line separators become visible escapes first; non-ASCII text is kept
/// as is (the page is UTF-8).
/// </summary>
internal static class HtmlText
{
    public static string Escape(string? s)
    {
        var visible = SafeText.Visible(s);
        var sb = new StringBuilder(visible.Length + 8);
        Append(sb, visible);
        return sb.ToString();
    }

    private static void Append(StringBuilder sb, string s)
    {
        foreach (var c in s)
        {
            switch (c)
            {
                case '&': sb.Append("&amp;"); break;
                case '<': sb.Append("&lt;"); break;
                case '>': sb.Append("&gt;"); break;
                case '"': sb.Append("&quot;"); break;
                case '\'': sb.Append("&#39;"); break;
                default: sb.Append(c); break;
            }
        }
    }
}
