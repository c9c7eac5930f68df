using System.Text;
using System.Text.RegularExpressions;
using FsCheck.Xunit;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Text;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.Kernels;

/// <summary>
/// <c>lower</c> under boxed storage applies the Final_Sigma context of Unicode SpecialCasing.txt (Unicode
/// Standard §3.13, Table 3-17, "Context Specification for Casing"); Arrow storage maps Σ to σ wherever it stands
/// (docs/semantics.md).
/// </summary>
public sealed class FinalSigmaTests
{
    // Unicode Standard §3.13 (Table 3-17) and SpecialCasing.txt: "03A3; 03C2; 03A3; 03A3; Final_Sigma;".
    // Before Σ: a cased letter, then only case-ignorable characters; after it: no cased letter reached through
    // case-ignorable characters only. Expected values worked out by hand from those rules.
    [Theory]
    [InlineData("ΜΗΛΟΣ", "μηλος")]                  // word end
    [InlineData("ΟΔΟΣ ΣΟΦΙΑ", "οδος σοφια")]        // space is neither cased nor case-ignorable
    [InlineData("Σ", "σ")]                          // nothing cased before
    [InlineData("ΣΑ", "σα")]                        // word start
    [InlineData("ΑΣΑ", "ασα")]                      // inside a word: a cased letter follows
    [InlineData("ΑΣ.", "ας.")]                      // U+002E is MidNumLet (case-ignorable), then the end
    [InlineData("ΑΣ.Β", "ασ.β")]                    // a cased letter after a case-ignorable one
    [InlineData("Α'Σ", "α'ς")]                      // U+0027 Single_Quote before Σ is skipped
    [InlineData("Α\u0301Σ", "α\u0301ς")]            // a combining acute (Mn) between
    [InlineData("ΑΣ\u0301", "ας\u0301")]            // ... and after
    [InlineData("ΑΣ\u0301Β", "ασ\u0301β")]
    [InlineData("1Σ", "1σ")]                        // a digit is not cased
    [InlineData("Α1Σ", "α1σ")]                      // and not case-ignorable: it stops the look-back
    [InlineData("ΑΣ1", "ας1")]                      // ... and the look-ahead
    [InlineData("\u02B0Σ", "\u02B0ς")]              // U+02B0 is Lm (case-ignorable) and Other_Lowercase (cased): it serves as the cased letter
    [InlineData("ΑΣ\u02B0", "ασ\u02B0")]            // ... also after Σ, where it blocks the final form
    [InlineData("ªΣ", "ªς")]                        // U+00AA is Lo but Other_Lowercase: cased
    [InlineData("ΑΣΣ", "ασς")]                      // only the last of two
    [InlineData("ΑΣ🚢", "ας🚢")]                    // a supplementary-plane symbol (So) ends the word
    [InlineData("𐐀Σ", "𐐨ς")]                       // U+10400 DESERET CAPITAL LONG I (Lu) before: cased, decoded as one code point
    [InlineData("Σ\u0308Σ", "σ\u0308ς")]          // the second Σ: Σ (cased) and U+0308 (Mn) before it, nothing after
    public void Boxed_lower_applies_final_sigma(string input, string expected)
    {
        Assert.Equal(expected, CaseMapping.ToLowerFinalSigma(input));
        foreach (var mode in new[] { Mode.Legacy, Mode.Parse("boxed+null+cow") })
            Assert.Equal(Value.Of(expected), StringKernels.Lower(K.Col(mode, input), mode).GetValue(0));
    }

    // docs/semantics.md: Arrow storage lower-cases code point by code point (no context): Σ is σ everywhere.
    // The library the modes model, on Arrow strings (from memory): no Final_Sigma.
    [Theory]
    [InlineData("modern")]
    [InlineData("arrow+nan+alias")]
    public void Arrow_lower_maps_every_sigma_to_small_sigma(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var r = StringKernels.Lower(K.Col(mode, "ΜΗΛΟΣ", "ΟΔΟΣ ΣΟΦΙΑ"), mode);
        Assert.Equal([Value.Of("μηλοσ"), Value.Of("οδοσ σοφια")], K.Values(r));
    }

    // Upper-casing has no context: ς and σ both become Σ (UnicodeData.txt simple mappings), in every storage.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Upper_maps_final_sigma_back(string spelling)
    {
        var mode = Mode.Parse(spelling);
        Assert.Equal(Value.Of("ΜΗΛΟΣ"), StringKernels.Upper(K.Col(mode, "μηλος"), mode).GetValue(0));
    }

    private static readonly int[] Palette = ['Σ', 'Α', 'σ', ' ', '1', '\'', '.', ':', 0x0301, 0x02B0, 0x00AA, 0x00AD, 'x', 'Z', 0x2019, 0x1F6A2];

    private static string Text(int[] codes)
    {
        var sb = new StringBuilder();
        foreach (var c in codes) sb.Append(char.ConvertFromUtf32(Palette[(c & int.MaxValue) % Palette.Length]));
        return sb.ToString();
    }

    // The context written as the regular expressions of Table 3-17 (Unicode Standard §3.13), with .NET's regex
    // engine doing the matching (look-behind and look-ahead, backtracking through characters that are both
    // cased and case-ignorable). Character classes for the palette: cased = Lu, Ll, Lt, U+02B0, U+00AA;
    // case-ignorable = Mn, Me, Cf, Lm, Sk, U+0027, U+002E, U+003A, U+2019.
    private const string Cased = @"[\p{Lu}\p{Ll}\p{Lt}\u02B0\u00AA]";
    private const string Ignorable = @"[\p{Mn}\p{Me}\p{Cf}\p{Lm}\p{Sk}'.:\u2019]";
    private static readonly Regex FinalSigma = new($"(?<={Cased}{Ignorable}*)Σ(?!{Ignorable}*{Cased})", RegexOptions.CultureInvariant);

    [Property(MaxTest = 300)]
    public bool Agrees_with_the_table_3_17_regular_expressions(int[] codes)
    {
        var s = Text(codes ?? []);
        var expected = FinalSigma.Replace(s, "ς").ToLowerInvariant();
        return string.Equals(CaseMapping.ToLowerFinalSigma(s), expected, StringComparison.Ordinal);
    }
}
