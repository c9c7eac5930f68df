using System.Text;
using FsCheck.Xunit;
using Parity.Engine.Columns;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Text;

namespace Parity.Tests.Engine.Kernels;

/// <summary>
/// The string kernels on both storages against .NET's own string and <see cref="Rune"/> APIs, on generated
/// text mixing ASCII, Latin, Greek, CJK, supplementary-plane emoji (surrogate pairs in UTF-16) and letters with
/// special full case mappings.
/// </summary>
public sealed class StringPropertyTests
{
    private static readonly int[] Palette =
    [
        'a', 'Z', ' ', '0', 0xE9, 0xDF, 0x3A3, 0x3C3, 0x390, 0x130, 0x131, 0xFB01, 0x5C71, 0x7530, 0x1F6A2, 0x1F600,
        0x10428, 0x1D11E, 0x00A0, 0xFFFD, 0x1F80, 0x587,
    ];

    private static string Text(int[] codes)
    {
        var sb = new StringBuilder();
        foreach (var c in codes) sb.Append(char.ConvertFromUtf32(Palette[(c & int.MaxValue) % Palette.Length]));
        return sb.ToString();
    }

    private static Column[] Both(params string[] cells)
    {
        var boxed = new ObjectColumn(cells, MissingMarker.Null);
        var arrow = new Utf8ColumnBuilder(cells.Length, 16);
        foreach (var s in cells) arrow.Append(s);
        return [boxed, arrow.Build(MissingMarker.Null)];
    }

    private static readonly Mode[] Modes = [new(StringStorage.Boxed, MissingMarker.Null, WriteSemantics.Cow), Mode.Modern];

    // .NET Rune enumeration counts code points (Unicode scalar values).
    [Property(MaxTest = 200)]
    public bool Length_matches_rune_count(int[] codes)
    {
        var s = Text(codes ?? []);
        var expected = s.EnumerateRunes().Count();
        var cols = Both(s);
        return StringKernels.Length(cols[0], Modes[0]).GetValue(0).Int64 == expected
            && StringKernels.Length(cols[1], Modes[1]).GetValue(0).Int64 == expected
            && Utf8Text.CodePointCount(Encoding.UTF8.GetBytes(s)) == expected;
    }

    // Full case mapping agrees with .NET's invariant casing wherever no special (SpecialCasing.txt) entry applies, and on both storages.
    [Property(MaxTest = 200)]
    public bool Upper_and_lower_agree(int[] codes)
    {
        var s = Text(codes ?? []);
        var cols = Both(s);
        var ub = StringKernels.Upper(cols[0], Modes[0]).GetValue(0).String;
        var ua = StringKernels.Upper(cols[1], Modes[1]).GetValue(0).String;
        var lb = StringKernels.Lower(cols[0], Modes[0]).GetValue(0).String;
        var la = StringKernels.Lower(cols[1], Modes[1]).GetValue(0).String;
        var plain = !s.Any(ch => ch is '\u00DF' or '\u0390' or '\u0130' or '\u0131' or '\uFB01' or '\u1F80' or '\u0587');
        // Boxed lower-casing also applies Final_Sigma (FinalSigmaTests); with ς read as σ the storages agree.
        var lbNoFinal = lb.Replace('\u03C2', '\u03C3');
        return ub == ua && lbNoFinal == la && string.Equals(lb, CaseMapping.ToLowerFinalSigma(s), StringComparison.Ordinal)
            && (!plain || (string.Equals(ub, s.ToUpperInvariant(), StringComparison.Ordinal) && string.Equals(lbNoFinal, s.ToLowerInvariant(), StringComparison.Ordinal)))
            && ub.Length >= s.Length;
    }

    // Substring against Rune-based slicing; predicates against string's ordinal Contains/StartsWith/EndsWith.
    [Property(MaxTest = 200)]
    public bool Substring_and_predicates(int[] codes, int start, byte count, int[] needleCodes)
    {
        var s = Text(codes ?? []);
        var needle = Text((needleCodes ?? []).Take(2).ToArray());
        var runes = s.EnumerateRunes().ToArray();
        var st = (start % 20) - 2;
        var lo = Math.Max(st, 1) - 1;
        var hi = Math.Min(st + count - 1, runes.Length);
        var expected = lo >= hi ? "" : string.Concat(runes[Math.Min(lo, runes.Length)..Math.Max(hi, Math.Min(lo, runes.Length))].Select(r => r.ToString()));
        var cols = Both(s);
        var ok = true;
        for (var k = 0; k < 2; k++)
        {
            var mode = Modes[k];
            var one = cols[k].Length;
            var sub = StringKernels.Substring(cols[k], K.Col(mode, (long)st), K.Col(mode, (long)count), mode).GetValue(0).String;
            ok &= sub == expected;
            var pat = K.Col(mode, needle);
            ok &= StringKernels.Match(StringPredicate.Contains, cols[k], pat, mode).GetValue(0).Bool == s.Contains(needle, StringComparison.Ordinal);
            ok &= StringKernels.Match(StringPredicate.StartsWith, cols[k], pat, mode).GetValue(0).Bool == s.StartsWith(needle, StringComparison.Ordinal);
            ok &= StringKernels.Match(StringPredicate.EndsWith, cols[k], pat, mode).GetValue(0).Bool == s.EndsWith(needle, StringComparison.Ordinal);
            ok &= one == 1;
        }
        return ok;
    }
}
