using System.Numerics;
using System.Runtime.Intrinsics;
using System.Text;

namespace Parity.Engine.Text;

/// <summary>
/// Code point helpers over UTF-8 bytes and UTF-16 strings. UTF-8 is self-synchronising (Unicode Standard
/// §3.9, Table 3-7): every code point starts with exactly one byte that is not a continuation byte
/// (<c>10xxxxxx</c>), so counting code points is counting non-continuation bytes, without decoding.
/// </summary>
public static class Utf8Text
{
    /// <summary>Number of Unicode code points in well-formed UTF-8 (vectorised; no decoding).</summary>
    public static int CodePointCount(ReadOnlySpan<byte> utf8)
    {
        var n = utf8.Length;
        var continuation = 0;
        var i = 0;
        if (Vector256.IsHardwareAccelerated && n >= Vector256<byte>.Count)
        {
            var mask = Vector256.Create((byte)0xC0);
            var cont = Vector256.Create((byte)0x80);
            for (; i + Vector256<byte>.Count <= n; i += Vector256<byte>.Count)
            {
                var v = Vector256.Create(utf8.Slice(i, Vector256<byte>.Count));
                var eq = Vector256.Equals(v & mask, cont);
                continuation += BitOperations.PopCount(eq.ExtractMostSignificantBits());
            }
        }
        else if (Vector128.IsHardwareAccelerated && n >= Vector128<byte>.Count)
        {
            var mask = Vector128.Create((byte)0xC0);
            var cont = Vector128.Create((byte)0x80);
            for (; i + Vector128<byte>.Count <= n; i += Vector128<byte>.Count)
            {
                var v = Vector128.Create(utf8.Slice(i, Vector128<byte>.Count));
                var eq = Vector128.Equals(v & mask, cont);
                continuation += BitOperations.PopCount(eq.ExtractMostSignificantBits());
            }
        }
        for (; i < n; i++)
            if ((utf8[i] & 0xC0) == 0x80) continuation++;
        return n - continuation;
    }

    /// <summary>Number of code points in a UTF-16 string; a lone surrogate counts as one (it decodes to U+FFFD).</summary>
    public static int CodePointCount(ReadOnlySpan<char> utf16)
    {
        var n = utf16.Length;
        var pairs = 0;
        for (var i = 0; i + 1 < n; i++)
        {
            if (char.IsHighSurrogate(utf16[i]) && char.IsLowSurrogate(utf16[i + 1]))
            {
                pairs++;
                i++;
            }
        }
        return n - pairs;
    }

    /// <summary>
    /// Byte index where code point number <paramref name="count"/> (0-based) starts, or the length when the
    /// text has fewer code points. Skips continuation bytes only.
    /// </summary>
    public static int ByteIndexOfCodePoint(ReadOnlySpan<byte> utf8, int count)
    {
        if (count <= 0) return 0;
        var seen = 0;
        for (var i = 0; i < utf8.Length; i++)
        {
            if ((utf8[i] & 0xC0) == 0x80) continue;
            if (seen == count) return i;
            seen++;
        }
        return utf8.Length;
    }

    /// <summary>UTF-16 index where code point number <paramref name="count"/> (0-based) starts, or the length.</summary>
    public static int CharIndexOfCodePoint(ReadOnlySpan<char> utf16, int count)
    {
        if (count <= 0) return 0;
        var seen = 0;
        var i = 0;
        while (i < utf16.Length)
        {
            if (seen == count) return i;
            i += i + 1 < utf16.Length && char.IsHighSurrogate(utf16[i]) && char.IsLowSurrogate(utf16[i + 1]) ? 2 : 1;
            seen++;
        }
        return utf16.Length;
    }

    /// <summary>True when every byte is ASCII (vectorised by the runtime).</summary>
    public static bool IsAscii(ReadOnlySpan<byte> utf8) => Ascii.IsValid(utf8);

    /// <summary>True when <paramref name="utf8"/> is Unicode White_Space at <paramref name="index"/>; returns its byte length.</summary>
    internal static bool IsWhiteSpaceAt(ReadOnlySpan<byte> utf8, int index, out int length)
    {
        var b = utf8[index];
        if (b < 0x80)
        {
            length = 1;
            return b == ' ' || (b >= 0x09 && b <= 0x0D);
        }
        Rune.DecodeFromUtf8(utf8[index..], out var rune, out length);
        return Rune.IsWhiteSpace(rune);
    }

    /// <summary>The byte range of <paramref name="utf8"/> without leading and trailing Unicode White_Space.</summary>
    public static ReadOnlySpan<byte> Trim(ReadOnlySpan<byte> utf8)
    {
        var start = 0;
        while (start < utf8.Length && IsWhiteSpaceAt(utf8, start, out var len)) start += len;
        var end = utf8.Length;
        while (end > start)
        {
            Rune.DecodeLastFromUtf8(utf8[start..end], out var rune, out var len);
            if (!Rune.IsWhiteSpace(rune)) break;
            end -= len;
        }
        return utf8[start..end];
    }
}
