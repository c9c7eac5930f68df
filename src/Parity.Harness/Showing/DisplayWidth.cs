using System.Globalization;
using System.Text;

namespace Parity.Harness.Showing;

/// <summary>
/// How many terminal columns a text takes. Text is split into grapheme clusters (Unicode Standard Annex
/// #29, as .NET's <see cref="StringInfo"/> does); a cluster is 2 columns wide when its first code point is
/// East Asian Wide or Fullwidth (Unicode Standard Annex #11) or an emoji, or when it carries the emoji
/// presentation selector U+FE0F or is a flag (two regional indicators); a cluster of only format or
/// combining characters is 0 wide; anything else is 1. Terminals differ on a few emoji; this is the common
/// reading.
/// </summary>
public static class DisplayWidth
{
    // Ranges of East Asian Wide (W) and Fullwidth (F) code points, and emoji blocks shown wide, from
    // UAX #11 EastAsianWidth.txt, merged into blocks (value from memory; coarse inside emoji blocks).
    private static readonly (int First, int Last)[] WideRanges =
    [
        (0x1100, 0x115F), (0x231A, 0x231B), (0x2329, 0x232A), (0x23E9, 0x23EC), (0x23F0, 0x23F0), (0x23F3, 0x23F3),
        (0x25FD, 0x25FE), (0x2614, 0x2615), (0x2648, 0x2653), (0x267F, 0x267F), (0x2693, 0x2693), (0x26A1, 0x26A1),
        (0x26AA, 0x26AB), (0x26BD, 0x26BE), (0x26C4, 0x26C5), (0x26CE, 0x26CE), (0x26D4, 0x26D4), (0x26EA, 0x26EA),
        (0x26F2, 0x26F3), (0x26F5, 0x26F5), (0x26FA, 0x26FA), (0x26FD, 0x26FD), (0x2705, 0x2705), (0x270A, 0x270B),
        (0x2728, 0x2728), (0x274C, 0x274C), (0x274E, 0x274E), (0x2753, 0x2755), (0x2757, 0x2757), (0x2795, 0x2797),
        (0x27B0, 0x27B0), (0x27BF, 0x27BF), (0x2B1B, 0x2B1C), (0x2B50, 0x2B50), (0x2B55, 0x2B55),
        (0x2E80, 0x303E), (0x3041, 0x33FF), (0x3400, 0x4DBF), (0x4E00, 0x9FFF), (0xA000, 0xA4CF), (0xA960, 0xA97F),
        (0xAC00, 0xD7A3), (0xF900, 0xFAFF), (0xFE10, 0xFE19), (0xFE30, 0xFE6F), (0xFF00, 0xFF60), (0xFFE0, 0xFFE6),
        (0x16FE0, 0x16FE4), (0x17000, 0x18CFF), (0x1B000, 0x1B2FF), (0x1F004, 0x1F004), (0x1F0CF, 0x1F0CF),
        (0x1F18E, 0x1F18E), (0x1F191, 0x1F19A), (0x1F200, 0x1F202), (0x1F210, 0x1F23B), (0x1F240, 0x1F248),
        (0x1F250, 0x1F251), (0x1F260, 0x1F265), (0x1F300, 0x1F64F), (0x1F680, 0x1F6FF), (0x1F7E0, 0x1F7EB),
        (0x1F90C, 0x1F9FF), (0x1FA70, 0x1FAFF), (0x20000, 0x2FFFD), (0x30000, 0x3FFFD),
    ];

    /// <summary>The width of <paramref name="text"/> in terminal columns.</summary>
    public static int Of(string text)
    {
        var ascii = true;
        foreach (var c in text)
            if (c >= 0x7F) { ascii = false; break; }
        if (ascii) return text.Length;

        var width = 0;
        var e = StringInfo.GetTextElementEnumerator(text);
        while (e.MoveNext())
            width += OfCluster(e.GetTextElement());
        return width;
    }

    /// <summary>The width of one grapheme cluster: 0, 1 or 2.</summary>
    public static int OfCluster(string cluster)
    {
        if (cluster.Length == 0) return 0;
        if (Rune.DecodeFromUtf16(cluster, out var first, out _) != System.Buffers.OperationStatus.Done) return 1;
        if (IsWide(first.Value)) return 2;
        if (first.Value is >= 0x1F1E6 and <= 0x1F1FF) return 2; // regional indicators (flags)
        if (cluster.Contains('\uFE0F', StringComparison.Ordinal)) return 2;
        var cat = Rune.GetUnicodeCategory(first);
        if (cat is UnicodeCategory.NonSpacingMark or UnicodeCategory.EnclosingMark or UnicodeCategory.Format)
            return 0;
        return 1;
    }

    /// <summary>True for an East Asian Wide or Fullwidth code point, or an emoji shown wide.</summary>
    public static bool IsWide(int codePoint)
    {
        if (codePoint < 0x1100) return false;
        var lo = 0;
        var hi = WideRanges.Length - 1;
        while (lo <= hi)
        {
            var mid = (lo + hi) >>> 1;
            var (first, last) = WideRanges[mid];
            if (codePoint < first) hi = mid - 1;
            else if (codePoint > last) lo = mid + 1;
            else return true;
        }
        return false;
    }
}
