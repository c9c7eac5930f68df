using System.Numerics;
using System.Runtime.InteropServices;
using System.Text;
using System.Text.Unicode;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// The load-time check of one utf8 array read from a file: the offsets are non-negative, non-decreasing and end
/// inside the data buffer (Apache Arrow columnar format, "Variable-size Binary Layout"), the value bytes are
/// UTF-8 (Unicode, UTF-8, Table 3-7) and no value starts inside a character. It reads every byte once and is
/// memory-bound, so a large array is cut into parts (a slice of the offsets and a slice of the data each) that
/// are checked on all cores in one parallel pass; a mapped file's pages are faulted in on all of them too. The
/// answers do not depend on the cut; the rare failure is located afterwards by the caller, row by row.
/// </summary>
internal static class Utf8ArrayScan
{
    /// <summary>Below this many bytes (offsets and data together) one core does the whole pass.</summary>
    internal const int ParallelFromBytes = 16 << 20;

    /// <summary>What the pass found. <see cref="Ascii"/> and <see cref="Valid"/> mean nothing when the offsets are unsound.</summary>
    internal readonly record struct Outcome(bool OffsetsSound, bool Ascii, bool Valid, bool SplitCharacter);

    /// <param name="offsets">The array's n+1 offsets (already sliced to its own offset).</param>
    /// <param name="data">The whole value buffer: offsets index it directly.</param>
    public static Outcome Run(ReadOnlyMemory<int> offsets, ReadOnlyMemory<byte> data)
    {
        var o = offsets.Span;
        var total = (long)o.Length * sizeof(int) + Math.Max(0L, (long)o[^1] - o[0]);
        return Run(offsets, data, total < ParallelFromBytes || Environment.ProcessorCount < 2 ? 1 : Environment.ProcessorCount * 2);
    }

    /// <summary>The pass cut into <paramref name="parts"/> parts (1: on the calling thread).</summary>
    internal static Outcome Run(ReadOnlyMemory<int> offsets, ReadOnlyMemory<byte> data, int parts)
    {
        var o = offsets.Span;
        var first = o[0];
        var last = o[^1];
        if (first < 0 || last < first || last > data.Length) return new Outcome(false, false, false, false);
        var bytes = data[first..last];
        var unsound = 0;
        var nonAscii = 0;
        var invalid = 0;
        if (parts == 1)
        {
            ScanPart(offsets.Span, bytes.Span, 0, 1, ref unsound, ref nonAscii, ref invalid);
        }
        else
        {
            Parallel.For(0, parts, part =>
            {
                int u = 0, a = 0, v = 0;
                ScanPart(offsets.Span, bytes.Span, part, parts, ref u, ref a, ref v);
                if ((u | a | v) == 0) return;
                Interlocked.Or(ref unsound, u);
                Interlocked.Or(ref nonAscii, a);
                Interlocked.Or(ref invalid, v);
            });
        }
        if (unsound != 0) return new Outcome(false, false, false, false);
        if (nonAscii == 0) return new Outcome(true, true, true, false);
        if (invalid != 0) return new Outcome(true, false, false, false);
        // The whole range is valid, but a value starting on a continuation byte splits a character across two values,
        // which the range check alone cannot see. ASCII data cannot have one.
        var split = 0;
        if (parts == 1)
        {
            split = StartsInsideCharacter(offsets.Span, data.Span, 0, 1);
        }
        else
        {
            Parallel.For(0, parts, part =>
            {
                if (StartsInsideCharacter(offsets.Span, data.Span, part, parts) != 0) Interlocked.Or(ref split, 1);
            });
        }
        return new Outcome(true, false, true, split != 0);
    }

    /// <summary>Part <paramref name="part"/> of <paramref name="parts"/>: its offsets (each against the one before) and its data bytes.</summary>
    private static void ScanPart(ReadOnlySpan<int> offsets, ReadOnlySpan<byte> bytes, int part, int parts, ref int unsound, ref int nonAscii, ref int invalid)
    {
        var (lo, hi) = Slice(offsets.Length, part, parts);
        // Each offset is compared with the one before it, so a part starts one offset early; the first offset's sign
        // was checked by the caller.
        if (hi > lo) unsound = NegativeOrDecreasing(offsets[Math.Max(lo - 1, 0)..hi]) < 0 ? 1 : 0;
        // Only the cuts between parts move; the range itself is checked as it is (it may start inside a character).
        var start = part == 0 ? 0 : CharacterBoundary(bytes, Slice(bytes.Length, part, parts).Start);
        var end = part == parts - 1 ? bytes.Length : CharacterBoundary(bytes, Slice(bytes.Length, part + 1, parts).Start);
        var piece = bytes[start..end];
        if (Ascii.IsValid(piece)) return;
        nonAscii = 1;
        // Cut where a character starts, each piece is valid exactly when the whole is (the pieces concatenate to it).
        if (!Utf8.IsValid(piece)) invalid = 1;
    }

    /// <summary>
    /// The position at or after <paramref name="index"/> where a character can start: past at most three continuation
    /// bytes (UTF-8 has no longer run in a valid sequence). Both neighbouring parts compute the same cut.
    /// </summary>
    private static int CharacterBoundary(ReadOnlySpan<byte> bytes, int index)
    {
        var stop = Math.Min(bytes.Length, index + 3);
        while (index < stop && (bytes[index] & 0xC0) == 0x80) index++;
        return index;
    }

    private static int StartsInsideCharacter(ReadOnlySpan<int> offsets, ReadOnlySpan<byte> data, int part, int parts)
    {
        var (lo, hi) = Slice(offsets.Length - 1, part, parts);
        for (var i = lo; i < hi; i++)
        {
            var o = offsets[i];
            if (offsets[i + 1] > o && (data[o] & 0xC0) == 0x80) return 1;
        }
        return 0;
    }

    private static (int Start, int End) Slice(int length, int part, int parts)
    {
        var size = length / parts + 1;
        var start = (int)Math.Min(length, (long)part * size);
        return (start, (int)Math.Min(length, (long)start + size));
    }

    /// <summary>
    /// The OR over every offset and its difference from the one before: negative when any offset is negative or
    /// smaller than its predecessor (the difference of two non-negative ints cannot overflow). Vectorised.
    /// </summary>
    private static int NegativeOrDecreasing(ReadOnlySpan<int> offsets)
    {
        ref var start = ref MemoryMarshal.GetReference(offsets);
        var acc = Vector<int>.Zero;
        var i = 1;
        var width = Vector<int>.Count;
        for (; i + width <= offsets.Length; i += width)
        {
            var current = Vector.LoadUnsafe(ref start, (nuint)i);
            var previous = Vector.LoadUnsafe(ref start, (nuint)(i - 1));
            acc |= current | (current - previous);
        }
        var result = 0;
        for (var lane = 0; lane < width; lane++) result |= acc[lane];
        for (; i < offsets.Length; i++) result |= offsets[i] | (offsets[i] - offsets[i - 1]);
        return result;
    }
}
