namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Dense ranks for many distinct numeric keys: an LSD radix sort (8 bits a pass, passes where every key has
/// the same byte skipped) of order-preserving unsigned keys, then one scan. Used when hashing would be slower
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
        var hist = new int[8 * 256];
        for (var k = 0; k < count; k++)
        {
            var v = keys[k];
            for (var b = 0; b < 8; b++) hist[(b << 8) + (int)((v >> (b << 3)) & 0xFF)]++;
        }
        ulong[]? tk = null;
        int[]? tr = null;
        var offsets = new int[256];
        for (var b = 0; b < 8; b++)
        {
            var h = hist.AsSpan(b << 8, 256);
            var trivial = false;
            for (var d = 0; d < 256; d++)
            {
                if (h[d] == count) { trivial = true; break; }
                if (h[d] != 0) break;
            }
            if (trivial) continue;
            tk ??= new ulong[count];
            tr ??= new int[count];
            var sum = 0;
            for (var d = 0; d < 256; d++)
            {
                offsets[d] = sum;
                sum += h[d];
            }
            var shift = b << 3;
            for (var k = 0; k < count; k++)
            {
                var v = keys[k];
                var pos = offsets[(int)((v >> shift) & 0xFF)]++;
                tk[pos] = v;
                tr[pos] = rows[k];
            }
            (keys, tk) = (tk, keys);
            (rows, tr) = (tr, rows);
        }
    }
}
