using System.Globalization;
using System.Text;
using System.Xml;

namespace Parity.Harness.Reports.Internal;

/// <summary>
/// Text that XML 1.0 can carry (XML 1.0 §2.2 "Characters": tab, line feed, carriage return, U+0020–U+D7FF,
/// U+E000–U+FFFD, and supplementary code points as surrogate pairs). Anything else becomes the visible
/// escape <c>\u{X}</c>; the XML writer then escapes markup characters.
/// </summary>
internal static class XmlChars
{
    public static string Clean(string? s)
    {
        if (string.IsNullOrEmpty(s)) return "";
        StringBuilder? sb = null;
        for (var i = 0; i < s.Length; i++)
        {
            var c = s[i];
            if (char.IsHighSurrogate(c) && i + 1 < s.Length && XmlConvert.IsXmlSurrogatePair(s[i + 1], c))
            {
                sb?.Append(c).Append(s[i + 1]);
                i++;
                continue;
            }
            if (XmlConvert.IsXmlChar(c))
            {
                sb?.Append(c);
                continue;
            }
            sb ??= new StringBuilder(s, 0, i, s.Length + 8);
            sb.Append("\\u{").Append(((int)c).ToString("X", CultureInfo.InvariantCulture)).Append('}');
        }
        return sb?.ToString() ?? s;
    }
}
