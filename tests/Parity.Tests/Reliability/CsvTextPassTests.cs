using Parity.Engine.Columns;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Tests.Engine.IO;

namespace Parity.Tests.Reliability;

/// <summary>
/// The CSV loader keeps no text for a column while it may still be a number (docs/reliability.md, "Large
/// inputs"); a column that turns out not to be a number is read again as text. These check that the second
/// pass gives exactly the text of the file and the types of spec §6.
/// </summary>
public sealed class CsvTextPassTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    private Column Load(string csv, string column, Mode mode)
    {
        DataLoader.ClearCache();
        return DataLoader.Load(_files.Write("t.csv", csv), LoadOptions.Default, mode)[column];
    }

    [Theory]
    [InlineData("arrow+null+cow")]
    [InlineData("boxed+nan+alias")]
    public void Numbers_then_text_keep_the_text_as_written(string spelling)
    {
        var mode = Mode.Parse(spelling);
        // Spec §6: inference falls back to string; the text is the field as written (RFC 4180), not a re-formatted number.
        var c = Load("a,b\n007,1\n+3,2\n,3\n1e3,4\nÅsa 🚢,5\n", "a", mode);
        Assert.Equal(mode.IsArrow ? ColumnType.Utf8 : ColumnType.Object, c.Type);
        var strings = (IStringColumn)c;
        Assert.Equal("007", strings.GetString(0));
        Assert.Equal("+3", strings.GetString(1));
        Assert.True(c.IsMissing(2));
        Assert.Equal("1e3", strings.GetString(3));
        Assert.Equal("Åsa 🚢", strings.GetString(4));
        Assert.Equal(ColumnType.Int64, Load("a,b\n007,1\n+3,2\n,3\n1e3,4\nÅsa 🚢,5\n", "b", mode).Type);
    }

    [Fact]
    public void Missing_cells_before_the_first_text_need_no_second_pass_and_stay_missing()
    {
        var c = Load("a,b\n,1\n,2\nx,3\n", "a", Mode.Modern);
        Assert.Equal(ColumnType.Utf8, c.Type);
        Assert.True(c.IsMissing(0));
        Assert.True(c.IsMissing(1));
        Assert.Equal("x", ((IStringColumn)c).GetString(2));
    }

    [Fact]
    public void Ints_then_a_float_become_float64_exactly_also_above_two_to_the_53()
    {
        // IEEE 754 binary64: 2^53 + 1 has no exact form; the value is the nearest double to the text.
        var c = Load("a\n9007199254740993\n-12\n0.5\n", "a", Mode.Modern);
        Assert.Equal(ColumnType.Float64, c.Type);
        Assert.Equal(double.Parse("9007199254740993", System.Globalization.CultureInfo.InvariantCulture), c.GetValue(0).Float64);
        Assert.Equal(-12.0, c.GetValue(1).Float64);
        Assert.Equal(0.5, c.GetValue(2).Float64);
    }

    [Theory]
    [InlineData("a\ntrue\n\nFALSE\n", ColumnType.Bool)]
    [InlineData("a\n1\ntrue\n", ColumnType.Utf8)]
    [InlineData("a\n2026-01-01T00:00:00Z\n\n", ColumnType.Timestamp)]
    [InlineData("a\n5\n2026-01-01T00:00:00Z\n", ColumnType.Utf8)]
    [InlineData("a\n", ColumnType.Utf8)]
    public void Types_after_the_second_pass_follow_spec_6(string csv, ColumnType expected)
    {
        // Spec §6: int64, float64, bool, ISO 8601 timestamp, else string, over every non-missing field.
        Assert.Equal(expected, Load(csv, "a", Mode.Modern).Type);
    }
}
