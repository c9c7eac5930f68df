namespace Parity.Script.Running.Internal;

/// <summary>"Did you mean" for unknown column and frame names. Delegates to the shared suggester.</summary>
internal static class ColumnHints
{
    public static string DidYouMean(string name, IEnumerable<string> candidates)
    {
        string? best = null;
        var bestDistance = int.MaxValue;
        var limit = name.Length <= 3 ? 1 : Math.Max(2, name.Length / 3);
        foreach (var c in candidates)
        {
            if (string.Equals(c, name, StringComparison.Ordinal)) continue;
            var d = Distance(name.ToLowerInvariant(), c.ToLowerInvariant());
            if (d > limit || d >= Math.Max(name.Length, c.Length)) continue;
            if (d < bestDistance || (d == bestDistance && string.CompareOrdinal(c, best) < 0))
            {
                best = c;
                bestDistance = d;
            }
        }
        return best is null ? "" : " (did you mean '" + best + "'?)";
    }

    private static int Distance(string a, string b)
    {
        var prev = new int[b.Length + 1];
        var cur = new int[b.Length + 1];
        for (var j = 0; j <= b.Length; j++) prev[j] = j;
        for (var i = 1; i <= a.Length; i++)
        {
            cur[0] = i;
            for (var j = 1; j <= b.Length; j++)
                cur[j] = Math.Min(Math.Min(prev[j] + 1, cur[j - 1] + 1), prev[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
            (prev, cur) = (cur, prev);
        }
        return prev[b.Length];
    }
}
