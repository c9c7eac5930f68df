using System.Text;

namespace Parity.Harness.Reports.Internal;

/// <summary>
/// JSON strings must be valid Unicode: a lone surrogate (which no UTF-8 input can produce, but a boxed cell
/// could hold) becomes U+FFFD; everything else is written as is and escaped by the JSON writer.
/// </summary>
internal static class JsonText
{
    public static string Clean(string? s)
    {
        if (string.IsNullOrEmpty(s)) return "";
        var ok = true;
        for (var i = 0; i < s.Length; i++)
        {
            var c = s[i];
            if (char.IsHighSurrogate(c) && i + 1 < s.Length && char.IsLowSurrogate(s[i + 1])) { i++; continue; }
            if (char.IsSurrogate(c)) { ok = false; break; }
        }
        if (ok) return s;
        var sb = new StringBuilder(s.Length);
        for (var i = 0; i < s.Length; i++)
        {
            var c = s[i];
            if (char.IsHighSurrogate(c) && i + 1 < s.Length && char.IsLowSurrogate(s[i + 1]))
            {
                sb.Append(c).Append(s[i + 1]);
                i++;
                continue;
            }
            sb.Append(char.IsSurrogate(c) ? '\uFFFD' : c);
        }
        return sb.ToString();
    }
}
