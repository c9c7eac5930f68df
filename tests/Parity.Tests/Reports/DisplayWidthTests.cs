using Parity.Harness.Showing;

namespace Parity.Tests.Reports;

public sealed class DisplayWidthTests
{
    // Unicode Standard Annex #11 (East Asian Width) and #29 (grapheme clusters); widths as terminals
    // commonly draw them (value from memory).
    [Theory]
    [InlineData("", 0)]
    [InlineData("Harbor Line", 11)]
    [InlineData("Zo\u00EB", 3)] // precomposed ë
    [InlineData("Zoe\u0308", 3)] // e + combining diaeresis: one cluster
    [InlineData("\u0395\u03BB\u03AD\u03BD\u03B7", 5)] // Greek Ελένη: narrow
    [InlineData("\u674E\u5C0F\u9F8D", 6)] // CJK ideographs: wide
    [InlineData("\uFF21", 2)] // fullwidth A
    [InlineData("\uFF76", 1)] // halfwidth katakana
    [InlineData("\uAC00", 2)] // Hangul syllable
    [InlineData("\U0001F6A2", 2)] // ship emoji
    [InlineData("\U0001F469\u200D\U0001F469\u200D\U0001F467", 2)] // ZWJ family: one cluster
    [InlineData("\U0001F1EC\U0001F1F7", 2)] // flag: two regional indicators
    [InlineData("\u2764\uFE0F", 2)] // heart with emoji presentation selector
    [InlineData("\u2764", 1)] // heart, text presentation
    [InlineData("a\u200Bb", 2)] // zero width space
    public void Counts_terminal_columns(string text, int width) => Assert.Equal(width, DisplayWidth.Of(text));
}
