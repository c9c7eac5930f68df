using Parity.Engine.Modes;

namespace Parity.Tests.Engine;

public sealed class ModeTests
{
    // Spec §2: presets and the eight STRINGS+MISSING+WRITES spellings.
    [Theory]
    [InlineData("legacy", "boxed+nan+alias")]
    [InlineData("modern", "arrow+null+cow")]
    [InlineData("ARROW+nan+alias", "arrow+nan+alias")]
    [InlineData(" boxed+null+cow ", "boxed+null+cow")]
    public void Parses_presets_and_spellings(string text, string spelling)
    {
        Assert.True(Mode.TryParse(text, out var mode));
        Assert.Equal(spelling, mode.Spelling);
    }

    [Theory]
    [InlineData("")]
    [InlineData("boxed")]
    [InlineData("boxed+nan")]
    [InlineData("utf8+nan+alias")]
    [InlineData("boxed+none+cow")]
    [InlineData("boxed+nan+copy")]
    public void Rejects_other_words(string text) => Assert.False(Mode.TryParse(text, out _));

    [Fact]
    public void All_has_eight_distinct_modes_with_presets_at_the_ends()
    {
        Assert.Equal(8, Mode.All.Count);
        Assert.Equal(8, Mode.All.Distinct().Count());
        Assert.Equal(Mode.Legacy, Mode.All[0]);
        Assert.Equal(Mode.Modern, Mode.All[^1]);
    }

    [Fact]
    public void Lists_parse_in_order_without_duplicates()
    {
        Assert.True(Mode.TryParseList("modern, legacy,modern", out var modes, out _));
        Assert.Equal([Mode.Modern, Mode.Legacy], modes);
        Assert.False(Mode.TryParseList("legacy,bogus", out _, out var bad));
        Assert.Equal("bogus", bad);
    }
}
