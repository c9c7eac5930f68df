namespace Parity.Harness.Shrinking.Internal;

/// <summary>
/// Delta debugging (Zeller and Hildebrandt's ddmin): shrinks a list of items that passes a test to a
/// subset that still passes, trying chunks and their complements at ever finer granularity down to single
/// items, so the result is 1-minimal (removing any one item fails the test) unless the test gives up.
/// Deterministic: chunks are contiguous and tried in order.
/// </summary>
internal static class DeltaDebugging
{
    /// <summary>
    /// The reduced list. <paramref name="test"/> returns true (keeps the property), false (loses it) or null
    /// (stop: the time bound); after a null the best list so far is returned with <paramref name="stopped"/> set.
    /// </summary>
    public static int[] Minimize(int[] items, Func<int[], bool?> test, out bool stopped)
    {
        stopped = false;
        var current = items;
        var n = 2;
        while (current.Length >= 2)
        {
            var chunks = Split(current, n);
            var reduced = false;
            foreach (var chunk in chunks)
            {
                var r = test(chunk);
                if (r is null) { stopped = true; return current; }
                if (r.Value)
                {
                    current = chunk;
                    n = 2;
                    reduced = true;
                    break;
                }
            }
            if (!reduced && n > 2)
            {
                for (var i = 0; i < chunks.Count; i++)
                {
                    var complement = Complement(current, chunks[i]);
                    var r = test(complement);
                    if (r is null) { stopped = true; return current; }
                    if (r.Value)
                    {
                        current = complement;
                        n = Math.Max(n - 1, 2);
                        reduced = true;
                        break;
                    }
                }
            }
            if (reduced) continue;
            if (n >= current.Length) break;
            n = Math.Min(n * 2, current.Length);
        }
        return current;
    }

    private static List<int[]> Split(int[] items, int n)
    {
        var chunks = new List<int[]>(n);
        var start = 0;
        for (var i = 0; i < n; i++)
        {
            // Sizes differ by at most one; the earlier chunks take the extra items.
            var size = items.Length / n + (i < items.Length % n ? 1 : 0);
            chunks.Add(items.AsSpan(start, size).ToArray());
            start += size;
        }
        return chunks;
    }

    // The chunks are contiguous runs of the (ascending) list, so the complement is the two runs around it.
    private static int[] Complement(int[] items, int[] chunk)
    {
        var start = Array.IndexOf(items, chunk[0]);
        var result = new int[items.Length - chunk.Length];
        items.AsSpan(0, start).CopyTo(result);
        items.AsSpan(start + chunk.Length).CopyTo(result.AsSpan(start));
        return result;
    }
}
