namespace Parity.Harness.Project.Internal;

/// <summary>
/// Glob patterns of the project file: <c>*</c> matches any run of characters except <c>/</c>, <c>?</c> one
/// character except <c>/</c>, <c>**</c> any run including <c>/</c> (so <c>**/</c> also matches no folder).
/// Matching is ordinal and case-sensitive, the same on every platform (docs/workflow.md, "Project file").
/// </summary>
internal static class Glob
{
    public static bool HasWildcard(string pattern) => pattern.AsSpan().IndexOfAny('*', '?') >= 0;

    public static bool IsMatch(string pattern, string text) => Match(pattern.AsSpan(), text.AsSpan());

    private static bool Match(ReadOnlySpan<char> p, ReadOnlySpan<char> t)
    {
        while (p.Length > 0)
        {
            if (p[0] == '*')
            {
                var deep = p.Length > 1 && p[1] == '*';
                var rest = p[(deep ? 2 : 1)..];
                if (deep && rest.Length > 0 && rest[0] == '/' && Match(rest[1..], t)) return true; // "**/" over no folder
                for (var i = 0; i <= t.Length; i++)
                {
                    if (Match(rest, t[i..])) return true;
                    if (i < t.Length && !deep && t[i] == '/') return false;
                }
                return false;
            }
            if (t.Length == 0) return false;
            if (p[0] == '?' ? t[0] == '/' : p[0] != t[0]) return false;
            p = p[1..];
            t = t[1..];
        }
        return t.Length == 0;
    }
}
