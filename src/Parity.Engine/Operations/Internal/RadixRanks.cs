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
