using System.Text;

namespace Parity.Script.Diagnostics;

/// <summary>
/// "Did you mean" for unknown names (frames, columns, functions, keywords). Deterministic: the same name and
/// candidates always give the same answer, whatever their order.
/// </summary>
public static class NameSuggester
{
    /// <summary>
    /// The candidate closest to <paramref name="name"/>, or null when none is close. Distance is the optimal
    /// string alignment distance (insertions, deletions, substitutions, adjacent swaps) over Unicode code points,
    /// compared case-insensitively; a candidate qualifies within 1 edit for names of up to 3 code points and
    /// within max(2, length / 3) edits otherwise. Ties go to the smaller case-sensitive distance, then to the
    /// ordinally smaller candidate. When <paramref name="name"/> itself is a candidate there is nothing to suggest.
    /// </summary>
    public static string? Suggest(string name, IEnumerable<string> candidates)
    {
        var target = Lower(name);
        var limit = target.Length <= 3 ? 1 : Math.Max(2, target.Length / 3);
        var targetExact = CodePoints(name);
        string? best = null;
        var bestFolded = int.MaxValue;
        var bestExact = int.MaxValue;
        foreach (var candidate in candidates)
        {
            if (candidate is null) continue;
            if (string.Equals(candidate, name, StringComparison.Ordinal)) return null;
            var folded = Distance(target, Lower(candidate));
            if (folded > limit) continue;
            // An edit that rewrites every character of a short name is no suggestion.
            if (folded >= Math.Max(target.Length, CodePoints(candidate).Length)) continue;
            var exact = Distance(targetExact, CodePoints(candidate));
            if (folded < bestFolded
                || (folded == bestFolded && exact < bestExact)
                || (folded == bestFolded && exact == bestExact && string.CompareOrdinal(candidate, best) < 0))
            {
                best = candidate;
                bestFolded = folded;
                bestExact = exact;
            }
        }
        return best;
    }

    /// <summary><c> (did you mean 'x'?)</c> with a leading space, or the empty string when there is no suggestion.</summary>
    public static string DidYouMean(string name, IEnumerable<string> candidates)
    {
        var suggestion = Suggest(name, candidates);
        return suggestion is null ? "" : " (did you mean '" + suggestion + "'?)";
    }

    private static int[] CodePoints(string s)
    {
        var list = new List<int>(s.Length);
        foreach (var rune in s.EnumerateRunes()) list.Add(rune.Value);
        return list.ToArray();
    }

    private static int[] Lower(string s)
    {
        var list = new List<int>(s.Length);
        foreach (var rune in s.EnumerateRunes()) list.Add(Rune.ToLowerInvariant(rune).Value);
        return list.ToArray();
    }

    /// <summary>Optimal string alignment distance (restricted Damerau-Levenshtein).</summary>
    private static int Distance(int[] a, int[] b)
    {
        var rows = new int[a.Length + 1, b.Length + 1];
        for (var i = 0; i <= a.Length; i++) rows[i, 0] = i;
        for (var j = 0; j <= b.Length; j++) rows[0, j] = j;
        for (var i = 1; i <= a.Length; i++)
        {
            for (var j = 1; j <= b.Length; j++)
            {
                var cost = a[i - 1] == b[j - 1] ? 0 : 1;
                var d = Math.Min(Math.Min(rows[i - 1, j] + 1, rows[i, j - 1] + 1), rows[i - 1, j - 1] + cost);
                if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                    d = Math.Min(d, rows[i - 2, j - 2] + 1);
                rows[i, j] = d;
            }
        }
        return rows[a.Length, b.Length];
    }
}
