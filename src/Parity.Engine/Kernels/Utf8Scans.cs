using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using Parity.Engine.Columns;

namespace Parity.Engine.Kernels;

/// <summary>
/// Whole-buffer passes over an Arrow UTF-8 column: work on the data buffer in one vectorised sweep and map
/// positions back to rows through the offsets (absolute, so a slice works as it is), instead of one short
/// call per row. Shared by the string kernels and the comparisons with a literal.
/// </summary>
internal static class Utf8Scans
{
    /// <summary>
    /// Code points per row into <paramref name="counts"/>: byte lengths from the offsets, minus the
    /// continuation bytes (<c>10xxxxxx</c>; Unicode Standard §3.9, Table 3-7) found by one sweep of the data
    /// buffer. ASCII data (checked first, vectorised) needs no sweep.
    /// </summary>
    public static void CodePointCounts(Utf8Column u, Span<long> counts)
    {
        var n = u.Length;
        if (n == 0) return;
        ReadOnlySpan<int> off = u.Offsets;
        off = off[..(n + 1)];
        counts = counts[..n];
        for (var i = 0; i < counts.Length; i++) counts[i] = off[i + 1] - off[i];
        var start = off[0];
        var body = u.Data[start..off[n]];
        if (System.Text.Ascii.IsValid(body)) return;
        var row = 0;
        var i0 = 0;
        ref var b0 = ref MemoryMarshal.GetReference(body);
        if (Vector256.IsHardwareAccelerated)
        {
            var mask = Vector256.Create((byte)0xC0);
            var cont = Vector256.Create((byte)0x80);
            for (; i0 + Vector256<byte>.Count <= body.Length; i0 += Vector256<byte>.Count)
            {
                var v = Vector256.LoadUnsafe(ref b0, (nuint)i0);
                var bits = Vector256.Equals(v & mask, cont).ExtractMostSignificantBits();
                while (bits != 0)
                {
                    var at = start + i0 + BitOperations.TrailingZeroCount(bits);
                    bits &= bits - 1;
                    while (off[row + 1] <= at) row++;
                    counts[row]--;
                }
            }
        }
        else if (Vector128.IsHardwareAccelerated)
        {
            var mask = Vector128.Create((byte)0xC0);
            var cont = Vector128.Create((byte)0x80);
            for (; i0 + Vector128<byte>.Count <= body.Length; i0 += Vector128<byte>.Count)
            {
                var v = Vector128.LoadUnsafe(ref b0, (nuint)i0);
                var bits = Vector128.Equals(v & mask, cont).ExtractMostSignificantBits();
                while (bits != 0)
                {
                    var at = start + i0 + BitOperations.TrailingZeroCount(bits);
                    bits &= bits - 1;
                    while (off[row + 1] <= at) row++;
                    counts[row]--;
                }
            }
        }
        for (; i0 < body.Length; i0++)
        {
            if ((body[i0] & 0xC0) != 0x80) continue;
            var at = start + i0;
            while (off[row + 1] <= at) row++;
            counts[row]--;
        }
    }

    /// <summary>
    /// Sets <c>result[row]</c> for every row whose bytes contain <paramref name="pattern"/> (not empty): one
    /// vectorised search over the data buffer; a hit inside a row marks it and the search goes on at the next
    /// row; a hit that runs past its row's end is not a match there. Rows left false are not touched.
    /// Bytes of missing slots may match; callers apply the validity afterwards.
    /// </summary>
    public static void Contains(Utf8Column u, ReadOnlySpan<byte> pattern, Span<bool> result)
    {
        var n = u.Length;
        if (n == 0) return;
        ReadOnlySpan<int> off = u.Offsets;
        var data = u.Data;
        var end = off[n];
        var pos = off[0];
        var row = 0;
        while (pos < end)
        {
            var idx = data[pos..end].IndexOf(pattern);
            if (idx < 0) return;
            var hit = pos + idx;
            while (off[row + 1] <= hit) row++;
            // A later start in this row cannot fit either when this one runs past the row's end.
            if (hit + pattern.Length <= off[row + 1]) result[row] = true;
            pos = off[row + 1];
            row++;
        }
    }

    /// <summary><c>starts_with</c> / <c>ends_with</c> a fixed pattern, row by row over the offsets.</summary>
    public static void Affix(Utf8Column u, ReadOnlySpan<byte> pattern, bool atStart, Span<bool> result)
    {
        var n = u.Length;
        ReadOnlySpan<int> off = u.Offsets;
        var data = u.Data;
        var p = pattern.Length;
        for (var i = 0; i < n; i++)
        {
            int s = off[i], e = off[i + 1];
            if (e - s < p) { result[i] = false; continue; }
            result[i] = data.Slice(atStart ? s : e - p, p).SequenceEqual(pattern);
        }
    }

    /// <summary>
    /// Each row compared with <paramref name="literal"/>: -1, 0, 1 in UTF-8 byte order (which is code point
    /// order, Unicode Standard §2.5). Equality compares the lengths from the offsets first, then the bytes.
    /// </summary>
    public static void Compare(Utf8Column u, ReadOnlySpan<byte> literal, ComparisonOp op, Span<bool> result)
    {
        var n = u.Length;
        ReadOnlySpan<int> off = u.Offsets;
        var data = u.Data;
        if (op is ComparisonOp.Equal or ComparisonOp.NotEqual)
        {
            var want = op == ComparisonOp.Equal;
            var p = literal.Length;
            if (p == 0)
            {
                for (var i = 0; i < n; i++) result[i] = (off[i + 1] == off[i]) == want;
                return;
            }
            var first = literal[0];
            for (var i = 0; i < n; i++)
            {
                var s = off[i];
                var eq = off[i + 1] - s == p && data[s] == first && data.Slice(s, p).SequenceEqual(literal);
                result[i] = eq == want;
            }
            return;
        }
        for (var i = 0; i < n; i++)
        {
            var c = data[off[i]..off[i + 1]].SequenceCompareTo(literal);
            result[i] = op switch
            {
                ComparisonOp.Less => c < 0,
                ComparisonOp.LessOrEqual => c <= 0,
                ComparisonOp.Greater => c > 0,
                _ => c >= 0,
            };
        }
    }

    /// <summary>A compact copy of the column's validity (bit offset 0), or all-valid: a byte copy, not per-row bit sets.</summary>
    public static Validity CopyValidity(Utf8Column u)
    {
        var n = u.Length;
        var array = u.Array;
        if (array.NullCount == 0 || array.NullBitmapBuffer.IsEmpty) return Validity.AllValid(n);
        var src = array.NullBitmapBuffer.Span;
        var bytes = (n + 7) >> 3;
        var bits = new byte[bytes];
        var shift = array.Offset & 7;
        var first = array.Offset >> 3;
        if (shift == 0)
        {
            src.Slice(first, bytes).CopyTo(bits);
        }
        else
        {
            // A slice that starts inside a byte: shift each output byte together from two input bytes.
            for (var k = 0; k < bytes; k++)
            {
                var lo = src[first + k] >> shift;
                var hi = first + k + 1 < src.Length ? src[first + k + 1] << (8 - shift) : 0;
                bits[k] = (byte)(lo | hi);
            }
        }
        // Bits past the end stay clear so the bitmap compares and counts cleanly.
        if ((n & 7) != 0) bits[^1] &= (byte)((1 << (n & 7)) - 1);
        return new Validity(bits, 0, n);
    }

    /// <summary>Writes <paramref name="value"/> into every row that <paramref name="validity"/> marks missing.</summary>
    public static void FillMissing(Validity validity, Span<bool> result, bool value)
    {
        if (!validity.HasBitmap) return;
        var bits = validity.Bits.Span;
        var n = validity.Length;
        for (var k = 0; k < bits.Length && k * 8 < n; k++)
        {
            var b = bits[k];
            if (b == 0xFF) continue;
            for (var j = 0; j < 8; j++)
            {
                var i = k * 8 + j;
                if (i >= n) break;
                if ((b & (1 << j)) == 0) result[i] = value;
            }
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static bool HasMissing(Utf8Column u) => u.Array.NullCount > 0;
}
