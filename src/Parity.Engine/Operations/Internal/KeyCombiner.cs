namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Combines per-column ranks into one 64-bit key per row that orders rows lexicographically by the columns
/// (key = key * card + rank), re-densifying whenever the next product could overflow. A negative key marks
/// a dropped row.
/// </summary>
internal static class KeyCombiner
{
    /// <summary>Appends one column of ranks (negative rank drops the row) with <paramref name="nextCard"/> distinct ranks.</summary>
    public static void Append(long[] acc, ref long card, ReadOnlySpan<int> next, long nextCard)
    {
        if (nextCard < 1) nextCard = 1;
        if (card > long.MaxValue / nextCard) card = Densify(acc, card);
        for (var i = 0; i < acc.Length; i++)
        {
            var a = acc[i];
            if (a < 0) continue;
            var r = next[i];
            acc[i] = r < 0 ? -1 : a * nextCard + r;
        }
        card *= nextCard;
    }

    /// <summary>Rewrites non-negative keys as dense ranks 0..d-1 in ascending key order; returns d.</summary>
    public static int Densify(long[] acc, long card)
    {
        var n = acc.Length;
        if (card <= Math.Min((long)n * 2 + 1024, Array.MaxLength))
        {
            var table = new int[card];
            for (var i = 0; i < n; i++)
                if (acc[i] >= 0) table[acc[i]] = 1;
            var next = 0;
            for (var k = 0; k < table.Length; k++)
                if (table[k] != 0) table[k] = ++next;
            for (var i = 0; i < n; i++)
                if (acc[i] >= 0) acc[i] = table[acc[i]] - 1;
            return next;
        }
        // Sparse keys: a radix sort ranks them without hashing (most combined keys are rare).
        var keys = new ulong[n];
        var rows = new int[n];
        var m = 0;
        for (var i = 0; i < n; i++)
        {
            if (acc[i] < 0) continue;
            keys[m] = (ulong)acc[i];
            rows[m++] = i;
        }
        var ranks = new int[n];
        var distinct = RadixRanks.Rank(keys, rows, m, ranks);
        for (var i = 0; i < n; i++)
            if (acc[i] >= 0) acc[i] = ranks[i];
        return distinct;
    }
}
