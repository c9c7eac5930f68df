using System.Text.Unicode;
using FsCheck.Xunit;
using Parity.Engine.IO.Internal;

namespace Parity.Tests.Engine.IO;

public sealed class Utf8ArrayScanTests
{
    // UTF-8 encodings of U+00E9, U+20AC and U+1F30A (Unicode, UTF-8, Table 3-7; from memory, checked by
    // Utf8.IsValid below), and bytes that are never valid on their own.
    private static readonly byte[][] Pieces =
    [
        "a"u8.ToArray(), "Z"u8.ToArray(), [0xC3, 0xA9], [0xE2, 0x82, 0xAC], [0xF0, 0x9F, 0x8C, 0x8A], [0xA9], [0xFF],
    ];

    // Property: cut into any number of parts, the pass answers what a plain sequential reading gives: offsets sound
    // (Apache Arrow columnar format, "Variable-size Binary Layout"), ASCII, valid UTF-8 as .NET's Utf8.IsValid
    // decides, and whether a value starts on a continuation byte.
    [Property(MaxTest = 400)]
    public bool Any_cut_answers_as_one_sequential_reading(int seed)
    {
        var random = new Random(seed);
        var data = new List<byte>();
        var tokens = random.Next(0, 120);
        var broken = random.Next(4) == 0;
        var ascii = random.Next(3) == 0;
        for (var t = 0; t < tokens; t++)
            data.AddRange(Pieces[ascii ? random.Next(2) : random.Next(broken ? Pieces.Length : Pieces.Length - 2)]);
        var bytes = data.ToArray();
        var n = random.Next(0, 40);
        var offsets = new int[n + 1];
        for (var i = 0; i <= n; i++) offsets[i] = random.Next(0, bytes.Length + 1);
        Array.Sort(offsets);
        if (random.Next(8) == 0 && n > 0)
        {
            var i = random.Next(n + 1);
            offsets[i] = random.Next(3) switch { 0 => -1, 1 => bytes.Length + 1, _ => offsets[i] + 1 - offsets[^1] };
        }
        var parts = random.Next(1, 10);
        return Utf8ArrayScan.Run(offsets, bytes, parts) == Reference(offsets, bytes);
    }

    // The same data on one core and on both, from the size where the pass is split: the public entry point.
    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void A_large_array_is_answered_the_same_whole_or_split(bool splitCharacter)
    {
        const int n = 2_000_000; // 8 MB of offsets and 12 MB of data: above the 16 MB where the pass is split
        var bytes = new byte[n * 6];
        var offsets = new int[n + 1];
        for (var i = 0; i < n; i++)
        {
            "ab"u8.CopyTo(bytes.AsSpan(i * 6));
            "🌊"u8.CopyTo(bytes.AsSpan(i * 6 + 2));
            offsets[i + 1] = (i + 1) * 6;
        }
        if (splitCharacter) offsets[n - 7] -= 1; // the value starts on the last byte of U+1F30A
        var expected = Reference(offsets, bytes);
        Assert.Equal(splitCharacter, expected.SplitCharacter);
        Assert.Equal(expected, Utf8ArrayScan.Run(offsets, bytes));
        Assert.Equal(expected, Utf8ArrayScan.Run(offsets, bytes, 1));
    }

    private static Utf8ArrayScan.Outcome Reference(int[] offsets, byte[] data)
    {
        for (var i = 0; i < offsets.Length; i++)
            if (offsets[i] < 0 || offsets[i] > data.Length || (i > 0 && offsets[i] < offsets[i - 1])) return new(false, false, false, false);
        var range = data.AsSpan(offsets[0], offsets[^1] - offsets[0]);
        var ascii = true;
        foreach (var b in range) ascii &= b < 0x80;
        if (ascii) return new(true, true, true, false);
        if (!Utf8.IsValid(range)) return new(true, false, false, false);
        var split = false;
        for (var i = 0; i + 1 < offsets.Length; i++)
            split |= offsets[i + 1] > offsets[i] && (data[offsets[i]] & 0xC0) == 0x80;
        return new(true, false, true, split);
    }
}
