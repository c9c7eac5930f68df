using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Operations.Internal;

namespace Parity.Engine.Operations;

/// <summary>
/// Stable multi-key ordering (spec §2.2 "Ordering"). The order, in every mode:
/// <list type="bullet">
/// <item>numbers numerically (-0.0 equals 0.0); bools false &lt; true; timestamps by instant;</item>
/// <item>strings in Unicode code point order (UTF-8 byte order; boxed strings via <see cref="Text.CodePointOrder"/>);</item>
/// <item>mixed (object) columns by kind first: numbers &lt; bools &lt; strings &lt; timestamps, then by value;</item>
/// <item>a NaN that is a value (null modes) after every other value but before missing, in both directions;</item>
/// <item>missing values (any marker) last in both directions;</item>
/// <item>ties keep input order.</item>
/// </list>
/// Each key column is reduced to dense ranks (distinct values hashed from typed buffers, only the distinct
/// values sorted), the ranks are combined into one integer per row and a counting sort gives the permutation.
/// </summary>
public static class Sorting
{
    /// <summary>Row indices in sorted order: <c>result[k]</c> is the input row that goes to position k.</summary>
    public static int[] Permutation(Table table, IReadOnlyList<SortKey> keys)
    {
        var n = table.RowCount;
        if (keys.Count == 0 || n == 0) return ColumnRanker.Iota(n);
        var acc = new long[n];
        long card = 1;
        var sortRanks = new int[n];
        for (var k = 0; k < keys.Count; k++)
        {
            var index = table.IndexOf(keys[k].Column);
            if (index < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{keys[k].Column}'");
            var ranks = ColumnRanker.Rank(table.Columns[index]);
            SortRanks(ranks, keys[k].Descending, sortRanks);
            KeyCombiner.Append(acc, ref card, sortRanks, ranks.ValueCount + 1);
        }
        if (card > (long)n * 2 + 1024) card = KeyCombiner.Densify(acc, card);
        return CountingSort(acc, (int)card);
    }

    /// <summary>Ranks as sort positions: values (reversed when descending), then the NaN value, then missing.</summary>
    private static void SortRanks(KeyRanks ranks, bool descending, int[] into)
    {
        var src = ranks.Ranks;
        var missing = ranks.ValueCount;
        var top = ranks.OrdinaryCount - 1;
        for (var i = 0; i < src.Length; i++)
        {
            var r = src[i];
            into[i] = r < 0 ? missing : descending && r <= top ? top - r : r;
        }
    }

    /// <summary>Stable: rows with equal keys keep their input order.</summary>
    private static int[] CountingSort(long[] keys, int card)
    {
        var starts = new int[card + 1];
        for (var i = 0; i < keys.Length; i++) starts[keys[i] + 1]++;
        for (var k = 0; k < card; k++) starts[k + 1] += starts[k];
        var perm = new int[keys.Length];
        for (var i = 0; i < keys.Length; i++) perm[starts[keys[i]]++] = i;
        return perm;
    }
}
