namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Dense ranks for many distinct numeric keys: an LSD radix sort (11 bits a pass, passes where every key has
/// the same digit skipped) of order-preserving unsigned keys, then one scan. Used when hashing would be slower
/// because nearly every value is distinct.
/// </summary>
internal static class RadixRanks
{
    private const ulong SignBit = 0x8000_0000_0000_0000UL;

    /// <summary>Order-preserving unsigned form of a signed 64-bit integer.</summary>
    public static ulong OfLong(long v) => (ulong)v ^ SignBit;

    /// <summary>Order-preserving unsigned form of a non-NaN double (IEEE 754 total order; -0.0 folded into 0.0).</summary>
    public static ulong OfDouble(double d)
    {
        if (d == 0) d = 0; // -0.0 == 0.0
        var bits = (ulong)BitConverter.DoubleToInt64Bits(d);
        return (bits & SignBit) != 0 ? ~bits : bits | SignBit;
    }

    /// <summary>
    /// Sorts the first <paramref name="count"/> (key, row) pairs and writes <c>ranks[row]</c> = dense rank of
    /// the key. Returns the number of distinct keys. The arrays are used as scratch space.
    /// </summary>
    public static int Rank(ulong[] keys, int[] rows, int count, int[] ranks)
    {
        Sort(ref keys, ref rows, count);
        var next = -1;
        var prev = 0UL;
        for (var k = 0; k < count; k++)
        {
            var key = keys[k];
            if (next < 0 || key != prev)
            {
                next++;
                prev = key;
            }
            ranks[rows[k]] = next;
        }
        return next + 1;
    }

    /// <summary>
    /// Stable sort of the first <paramref name="count"/> (key, row) pairs for many keys, cache-friendly: a
    /// range too large for the cache is split by one most-significant pass over the top 11 bits that vary in
    /// it (2,048 buckets), recursively, so skewed keys (doubles sharing an exponent) still split; a range that
    /// fits in cache by LSD passes over its top 16 varying bits finished by insertion sort, and a tiny one by insertion sort.
    /// Every step is stable, so equal keys keep their order.
    /// </summary>
    public static void SortLarge(ref ulong[] keys, ref int[] rows, int count)
    {
        if (count < InCache)
        {
            Sort(ref keys, ref rows, count);
            return;
        }
        // Scratch from the shared pool (SortRange leaves the result in place, so nothing is swapped).
        var sk = System.Buffers.ArrayPool<ulong>.Shared.Rent(count);
        var sr = System.Buffers.ArrayPool<int>.Shared.Rent(count);
        SortRange(keys, rows, sk, sr, 0, count, new int[256]);
        System.Buffers.ArrayPool<ulong>.Shared.Return(sk);
        System.Buffers.ArrayPool<int>.Shared.Return(sr);
    }

    /// <summary>Ranges up to this many pairs (12 bytes each) are sorted by LSD passes while they stay in cache.</summary>
    private const int InCache = 1 << 16;

    /// <summary>Sorts <c>k[from..from+n)</c> with its rows in place; <paramref name="sk"/>/<paramref name="sr"/> are scratch.</summary>
    private static void SortRange(ulong[] k, int[] r, ulong[] sk, int[] sr, int from, int n, int[] hist)
    {
        if (n <= 32)
        {
            InsertionSort(k, r, from, n, long.MaxValue);
            return;
        }
        ulong any = 0, all = ulong.MaxValue;
        for (var i = from; i < from + n; i++)
        {
            any |= k[i];
            all &= k[i];
        }
        var varying = any ^ all;
        if (varying == 0) return; // one key: already in order
        var top = 63 - System.Numerics.BitOperations.LeadingZeroCount(varying);
        if (n <= InCache)
        {
            LsdRange(k, r, sk, sr, from, n, varying, top, hist);
            return;
        }
        const int TopBits = 11;
        const int Buckets = 1 << TopBits;
        var shift = Math.Max(0, top + 1 - TopBits);
        var starts = new int[Buckets + 1];
        for (var i = from; i < from + n; i++) starts[(int)((k[i] >> shift) & (Buckets - 1)) + 1]++;
        starts[0] = from;
        for (var d = 0; d < Buckets; d++) starts[d + 1] += starts[d];
        var fill = starts.AsSpan(0, Buckets).ToArray();
        for (var i = from; i < from + n; i++)
        {
            var v = k[i];
            var pos = fill[(int)((v >> shift) & (Buckets - 1))]++;
            sk[pos] = v;
            sr[pos] = r[i];
        }
        Array.Copy(sk, from, k, from, n);
        Array.Copy(sr, from, r, from, n);
        if (shift == 0) return; // the digit held every varying bit
        for (var d = 0; d < Buckets; d++)
        {
            var size = starts[d + 1] - starts[d];
            if (size > 1) SortRange(k, r, sk, sr, starts[d], size, hist);
        }
    }

    /// <summary>
    /// A range that fits in cache: stable 8-bit LSD passes over its top 16 varying bits, then insertion sort,
    /// which only moves keys that share those bits (few, for many distinct keys). When it moves more than
    /// eight per key the range holds many keys alike in their top bits; it is then finished by LSD passes over
    /// the lower bits and again over the top ones (every step is stable, so ties keep their order).
    /// </summary>
    private static void LsdRange(ulong[] k, int[] r, ulong[] sk, int[] sr, int from, int n, ulong varying, int top, int[] hist)
    {
        var low = Math.Max(0, top + 1 - 16);
        LsdPasses(k, r, sk, sr, from, n, varying, low, top + 1, hist);
        if (low == 0 || InsertionSort(k, r, from, n, 8L * n)) return;
        LsdPasses(k, r, sk, sr, from, n, varying, 0, low, hist);
        LsdPasses(k, r, sk, sr, from, n, varying, low, top + 1, hist);
    }

    /// <summary>
    /// Stable insertion sort (a key moves only past strictly greater ones); stops, false, once it has moved
    /// more than <paramref name="budget"/> keys, leaving the range a stable rearrangement of its input.
    /// </summary>
    private static bool InsertionSort(ulong[] k, int[] r, int from, int n, long budget)
    {
        for (var i = from + 1; i < from + n; i++)
        {
            var v = k[i];
            if (k[i - 1] <= v) continue;
            var row = r[i];
            var j = i - 1;
            while (j >= from && k[j] > v)
            {
                k[j + 1] = k[j];
                r[j + 1] = r[j];
                j--;
            }
            k[j + 1] = v;
            r[j + 1] = row;
            budget -= i - 1 - j;
            if (budget < 0) return false;
        }
        return true;
    }

    /// <summary>Stable 8-bit LSD passes over bits [<paramref name="fromBit"/>, <paramref name="toBit"/>) that vary; the result ends in <paramref name="k"/>.</summary>
    private static void LsdPasses(ulong[] k, int[] r, ulong[] sk, int[] sr, int from, int n, ulong varying, int fromBit, int toBit, int[] hist)
    {
        var inScratch = false;
        for (var shift = fromBit; shift < toBit; shift += 8)
        {
            var mask = (1UL << Math.Min(8, toBit - shift)) - 1;
            if (((varying >> shift) & mask) == 0) continue;
            var (srcK, srcR, dstK, dstR) = inScratch ? (sk, sr, k, r) : (k, r, sk, sr);
            Array.Clear(hist);
            for (var i = from; i < from + n; i++) hist[(int)((srcK[i] >> shift) & mask)]++;
            var sum = from;
            for (var d = 0; d < 256; d++)
            {
                var c = hist[d];
                hist[d] = sum;
                sum += c;
            }
            for (var i = from; i < from + n; i++)
            {
                var v = srcK[i];
                var pos = hist[(int)((v >> shift) & mask)]++;
                dstK[pos] = v;
                dstR[pos] = srcR[i];
            }
            inScratch = !inScratch;
        }
        if (inScratch)
        {
            Array.Copy(sk, from, k, from, n);
            Array.Copy(sr, from, r, from, n);
        }
    }

    /// <summary>Stable LSD radix sort of the first <paramref name="count"/> (key, row) pairs; the arrays may be swapped for scratch ones.</summary>
    public static void Sort(ref ulong[] keys, ref int[] rows, int count)
    {
        // 11-bit digits: six passes cover 64 bits, and each histogram (2,048 counts) stays in L1.
        const int Bits = 11;
        const int Buckets = 1 << Bits;
        const int Passes = 6;
        var hist = new int[Passes * Buckets];
        for (var k = 0; k < count; k++)
        {
            var v = keys[k];
            for (var b = 0; b < Passes; b++) hist[(b * Buckets) + (int)((v >> (b * Bits)) & (Buckets - 1))]++;
        }
        ulong[]? tk = null;
        int[]? tr = null;
        var offsets = new int[Buckets];
        for (var b = 0; b < Passes; b++)
        {
            var h = hist.AsSpan(b * Buckets, Buckets);
            var trivial = false;
            for (var d = 0; d < Buckets; d++)
            {
                if (h[d] == count) { trivial = true; break; }
                if (h[d] != 0) break;
            }
            if (trivial) continue;
            tk ??= new ulong[count];
            tr ??= new int[count];
            var sum = 0;
            for (var d = 0; d < Buckets; d++)
            {
                offsets[d] = sum;
                sum += h[d];
            }
            var shift = b * Bits;
            for (var k = 0; k < count; k++)
            {
                var v = keys[k];
                var pos = offsets[(int)((v >> shift) & (Buckets - 1))]++;
                tk[pos] = v;
                tr[pos] = rows[k];
            }
            (keys, tk) = (tk, keys);
            (rows, tr) = (tr, rows);
        }
    }
}
