using System.Buffers;
using System.Globalization;
using System.Text;

namespace Parity.Engine.Text;

/// <summary>
/// Unicode full case mapping (Unicode Standard §3.13, "Default Case Conversion"): each code point maps through
/// the unconditional entries of SpecialCasing.txt when it has one, else through its simple mapping
/// (UnicodeData.txt, as .NET's invariant <see cref="Rune.ToUpperInvariant"/> gives it). Language-sensitive
/// mappings (Turkish, Lithuanian) are never applied: the result must not depend on a locale. The one
/// context-sensitive mapping, Final_Sigma, is applied by <see cref="ToLowerFinalSigma"/> only, which boxed
/// string storage uses (docs/semantics.md: Arrow's lower-casing maps Σ to σ wherever it stands).
/// <para>
/// The table below holds every unconditional SpecialCasing.txt entry whose full mapping differs from the
/// simple one (Unicode 15.1, value from memory), plus two UnicodeData.txt simple mappings that .NET's invariant
/// casing deliberately leaves out (U+0131 dotless i uppercases to U+0049; U+0130 lowercases fully to
/// U+0069 U+0307).
/// </para>
/// </summary>
public static class CaseMapping
{
    private static readonly Dictionary<int, string> Upper = BuildUpper();
    private static readonly Dictionary<int, string> Lower = new() { [0x0130] = "i\u0307" };
    private static readonly Dictionary<int, byte[]> UpperUtf8 = ToUtf8(Upper);
    private static readonly Dictionary<int, byte[]> LowerUtf8 = ToUtf8(Lower);

    /// <summary>Largest growth in UTF-8 bytes of one code point under either mapping (U+0390: 2 bytes to 6).</summary>
    public const int MaxUtf8Growth = 3;

    /// <summary>Largest growth in UTF-16 units of one code point (U+1FB7: 1 unit to 3).</summary>
    public const int MaxUtf16Growth = 3;

    public static string ToUpper(string s) => Map(s, upper: true);

    public static string ToLower(string s) => Map(s, upper: false);

    /// <summary>
    /// <see cref="ToLower(string)"/> with the Final_Sigma context of SpecialCasing.txt (Unicode Standard §3.13,
    /// Table 3-17): U+03A3 Σ becomes U+03C2 ς when a cased letter comes before it, with only case-ignorable
    /// characters between, and no cased letter comes after it with only case-ignorable characters between;
    /// otherwise σ.
    /// </summary>
    public static string ToLowerFinalSigma(string s)
    {
        var sigma = s.IndexOf('\u03A3', StringComparison.Ordinal);
        if (sigma < 0) return Map(s, upper: false);
        var sb = new StringBuilder(s.Length + 8);
        sb.Append(Map(s[..sigma], upper: false));
        var i = sigma;
        while (i < s.Length)
        {
            var next = s.IndexOf('\u03A3', i);
            if (next < 0)
            {
                sb.Append(Map(s[i..], upper: false));
                break;
            }
            if (next > i) sb.Append(Map(s[i..next], upper: false));
            sb.Append(IsFinalSigma(s, next) ? '\u03C2' : '\u03C3');
            i = next + 1;
        }
        return sb.ToString();
    }

    /// <summary>
    /// Final_Sigma at <paramref name="at"/>: before it <c>\p{cased} (\p{case-ignorable})*</c>, and after it not
    /// <c>(\p{case-ignorable})* \p{cased}</c>. A character may be both cased and case-ignorable (U+02B0): as in
    /// the regular expressions, it then serves as the cased letter.
    /// </summary>
    internal static bool IsFinalSigma(string s, int at)
    {
        var before = false;
        for (var i = at; i > 0;)
        {
            Rune.DecodeLastFromUtf16(s.AsSpan(0, i), out var r, out var len);
            i -= len;
            if (IsCased(r)) { before = true; break; }
            if (!IsCaseIgnorable(r)) break;
        }
        if (!before) return false;
        for (var i = at + 1; i < s.Length;)
        {
            Rune.DecodeFromUtf16(s.AsSpan(i), out var r, out var len);
            i += len;
            if (IsCased(r)) return false;
            if (!IsCaseIgnorable(r)) break;
        }
        return true;
    }

    /// <summary>
    /// Cased (Unicode Standard §3.13, D135): Lowercase or Uppercase (general categories Ll, Lu plus
    /// Other_Lowercase, Other_Uppercase of PropList.txt) or general category Lt. The Other_ ranges are from
    /// memory of PropList.txt (Unicode 15.1).
    /// </summary>
    internal static bool IsCased(Rune r)
    {
        switch (Rune.GetUnicodeCategory(r))
        {
            case UnicodeCategory.UppercaseLetter:
            case UnicodeCategory.LowercaseLetter:
            case UnicodeCategory.TitlecaseLetter:
                return true;
        }
        var v = r.Value;
        foreach (var (lo, hi) in OtherCased)
        {
            if (v < lo) return false;
            if (v <= hi) return true;
        }
        return false;
    }

    /// <summary>
    /// Case_Ignorable (Unicode Standard §3.13, D136): general category Mn, Me, Cf, Lm or Sk, or Word_Break
    /// MidLetter, MidNumLet or Single_Quote (WordBreakProperty.txt; the code points below from memory).
    /// </summary>
    internal static bool IsCaseIgnorable(Rune r)
    {
        switch (Rune.GetUnicodeCategory(r))
        {
            case UnicodeCategory.NonSpacingMark:
            case UnicodeCategory.EnclosingMark:
            case UnicodeCategory.Format:
            case UnicodeCategory.ModifierLetter:
            case UnicodeCategory.ModifierSymbol:
                return true;
        }
        return r.Value switch
        {
            0x0027 => true,                                                      // Single_Quote
            0x002E or 0x2018 or 0x2019 or 0x2024 or 0xFE52 or 0xFF07 or 0xFF0E => true, // MidNumLet
            0x003A or 0x00B7 or 0x0387 or 0x055F or 0x05F4 or 0x2027 or 0xFE13 or 0xFE55 or 0xFF1A => true, // MidLetter
            _ => false,
        };
    }

    /// <summary>Other_Lowercase and Other_Uppercase (PropList.txt), merged and sorted by first code point.</summary>
    private static readonly (int Lo, int Hi)[] OtherCased =
    [
        (0x00AA, 0x00AA), (0x00BA, 0x00BA), (0x02B0, 0x02B8), (0x02C0, 0x02C1), (0x02E0, 0x02E4), (0x0345, 0x0345),
        (0x037A, 0x037A), (0x10FC, 0x10FC), (0x1D2C, 0x1D6A), (0x1D78, 0x1D78), (0x1D9B, 0x1DBF), (0x2071, 0x2071),
        (0x207F, 0x207F), (0x2090, 0x209C), (0x2160, 0x217F), (0x24B6, 0x24E9), (0x2C7C, 0x2C7D), (0xA69C, 0xA69D),
        (0xA770, 0xA770), (0xA7F2, 0xA7F4), (0xA7F8, 0xA7F9), (0xAB5C, 0xAB5F), (0xAB69, 0xAB69), (0x10780, 0x10780),
        (0x10783, 0x10785), (0x10787, 0x107B0), (0x107B2, 0x107BA), (0x1E030, 0x1E06D), (0x1F130, 0x1F149),
        (0x1F150, 0x1F169), (0x1F170, 0x1F189),
    ];

    /// <summary>Maps <paramref name="utf8"/> into <paramref name="destination"/> (at least <see cref="MaxUtf8Growth"/> times as long); returns bytes written.</summary>
    public static int ToUpper(ReadOnlySpan<byte> utf8, Span<byte> destination) => Map(utf8, destination, upper: true);

    public static int ToLower(ReadOnlySpan<byte> utf8, Span<byte> destination) => Map(utf8, destination, upper: false);

    private static string Map(string s, bool upper)
    {
        if (Ascii.IsValid(s)) return upper ? s.ToUpperInvariant() : s.ToLowerInvariant();
        var rented = ArrayPool<char>.Shared.Rent(s.Length * MaxUtf16Growth);
        try
        {
            var dst = rented.AsSpan();
            var w = 0;
            var table = upper ? Upper : Lower;
            foreach (var rune in s.EnumerateRunes())
            {
                if (rune.Value >= 0x80 && table.TryGetValue(rune.Value, out var full))
                {
                    full.CopyTo(dst[w..]);
                    w += full.Length;
                    continue;
                }
                var m = upper ? Rune.ToUpperInvariant(rune) : Rune.ToLowerInvariant(rune);
                w += m.EncodeToUtf16(dst[w..]);
            }
            return new string(dst[..w]);
        }
        finally
        {
            ArrayPool<char>.Shared.Return(rented);
        }
    }

    private static int Map(ReadOnlySpan<byte> utf8, Span<byte> dst, bool upper)
    {
        var table = upper ? UpperUtf8 : LowerUtf8;
        var w = 0;
        var i = 0;
        while (i < utf8.Length)
        {
            var b = utf8[i];
            if (b < 0x80)
            {
                dst[w++] = upper ? (byte)((uint)(b - 'a') < 26u ? b - 32 : b) : (byte)((uint)(b - 'A') < 26u ? b + 32 : b);
                i++;
                continue;
            }
            Rune.DecodeFromUtf8(utf8[i..], out var rune, out var len);
            i += len;
            if (table.TryGetValue(rune.Value, out var full))
            {
                full.CopyTo(dst[w..]);
                w += full.Length;
                continue;
            }
            var m = upper ? Rune.ToUpperInvariant(rune) : Rune.ToLowerInvariant(rune);
            w += m.EncodeToUtf8(dst[w..]);
        }
        return w;
    }

    private static Dictionary<int, byte[]> ToUtf8(Dictionary<int, string> table)
    {
        var d = new Dictionary<int, byte[]>(table.Count);
        foreach (var (k, v) in table) d[k] = Encoding.UTF8.GetBytes(v);
        return d;
    }

    private static Dictionary<int, string> BuildUpper()
    {
        var d = new Dictionary<int, string>
        {
            [0x00DF] = "SS",                 // ß
            [0x0131] = "I",                  // ı (UnicodeData simple mapping; .NET invariant keeps it)
            [0x0149] = "\u02BCN",            // ŉ
            [0x01F0] = "J\u030C",            // ǰ
            [0x0390] = "\u0399\u0308\u0301", // ΐ
            [0x03B0] = "\u03A5\u0308\u0301", // ΰ
            [0x0587] = "\u0535\u0552",       // և
            [0x1E96] = "H\u0331",
            [0x1E97] = "T\u0308",
            [0x1E98] = "W\u030A",
            [0x1E99] = "Y\u030A",
            [0x1E9A] = "A\u02BE",
            [0x1F50] = "\u03A5\u0313",
            [0x1F52] = "\u03A5\u0313\u0300",
            [0x1F54] = "\u03A5\u0313\u0301",
            [0x1F56] = "\u03A5\u0313\u0342",
            [0x1FB2] = "\u1FBA\u0399",
            [0x1FB3] = "\u0391\u0399",
            [0x1FB4] = "\u0386\u0399",
            [0x1FB6] = "\u0391\u0342",
            [0x1FB7] = "\u0391\u0342\u0399",
            [0x1FBC] = "\u0391\u0399",
            [0x1FC2] = "\u1FCA\u0399",
            [0x1FC3] = "\u0397\u0399",
            [0x1FC4] = "\u0389\u0399",
            [0x1FC6] = "\u0397\u0342",
            [0x1FC7] = "\u0397\u0342\u0399",
            [0x1FCC] = "\u0397\u0399",
            [0x1FD2] = "\u0399\u0308\u0300",
            [0x1FD3] = "\u0399\u0308\u0301",
            [0x1FD6] = "\u0399\u0342",
            [0x1FD7] = "\u0399\u0308\u0342",
            [0x1FE2] = "\u03A5\u0308\u0300",
            [0x1FE3] = "\u03A5\u0308\u0301",
            [0x1FE4] = "\u03A1\u0313",
            [0x1FE6] = "\u03A5\u0342",
            [0x1FE7] = "\u03A5\u0308\u0342",
            [0x1FF2] = "\u1FFA\u0399",
            [0x1FF3] = "\u03A9\u0399",
            [0x1FF4] = "\u038F\u0399",
            [0x1FF6] = "\u03A9\u0342",
            [0x1FF7] = "\u03A9\u0342\u0399",
            [0x1FFC] = "\u03A9\u0399",
            [0xFB00] = "FF",
            [0xFB01] = "FI",
            [0xFB02] = "FL",
            [0xFB03] = "FFI",
            [0xFB04] = "FFL",
            [0xFB05] = "ST",
            [0xFB06] = "ST",
            [0xFB13] = "\u0544\u0546",
            [0xFB14] = "\u0544\u0535",
            [0xFB15] = "\u0544\u053B",
            [0xFB16] = "\u054E\u0546",
            [0xFB17] = "\u0544\u053D",
        };
        // Greek letters with ypogegrammeni / prosgegrammeni: U+1F80..U+1FAF uppercase to the capital with
        // psili/dasia plus U+0399 (both the small and the titlecase forms).
        for (var c = 0; c < 16; c++)
        {
            d[0x1F80 + c] = ((char)(0x1F08 + (c & 7))).ToString() + "\u0399";
            d[0x1F90 + c] = ((char)(0x1F28 + (c & 7))).ToString() + "\u0399";
            d[0x1FA0 + c] = ((char)(0x1F68 + (c & 7))).ToString() + "\u0399";
        }
        return d;
    }
}
