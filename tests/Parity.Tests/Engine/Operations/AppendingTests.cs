using Parity.Engine.Errors;
using Parity.Engine.Operations;
using Parity.Engine.Values;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

public sealed class AppendingTests
{
    // Spec §2.3: append matches columns by name, fills a column missing on one side with missing values, and
    // unifies int64 and float64 to float64.
    [Theory]
    [InlineData("legacy", "float64")]
    [InlineData("modern", "int64")]
    [InlineData("arrow+nan+alias", "float64")]
    [InlineData("boxed+null+cow", "int64")]
    public void Columns_match_by_name_and_missing_columns_fill(string spelling, string seatsType)
    {
        var mode = M(spelling);
        var top = Table(("fare", Col(mode, 10, 20)), ("name", Col(mode, "Zoë", "岸")));
        var bottom = Table(("name", Col(mode, "😀")), ("fare", Col(mode, 2.5)), ("seats", Col(mode, 4)));
        var a = Appending.Append(top, bottom, mode);
        Assert.Equal(["fare", "name", "seats"], a.Names);
        Assert.Equal("float64", a["fare"].TypeLabel);
        Assert.Equal([Value.Of(10.0), Value.Of(20.0), Value.Of(2.5)], Values(a["fare"]));
        Assert.Equal([Value.Of("Zoë"), Value.Of("岸"), Value.Of("😀")], Values(a["name"]));
        Assert.Equal(seatsType, a["seats"].TypeLabel);
        Assert.Equal([Missing(mode), Missing(mode), mode.IsNan ? Value.Of(4.0) : Value.Of(4L)], Values(a["seats"]));
    }

    // Spec §2.3: other type pairs follow the typed-write rule: boxed gives object, arrow gives E-TYPE.
    [Theory]
    [InlineData("legacy")]
    [InlineData("boxed+null+cow")]
    public void Different_types_become_object_under_boxed(string spelling)
    {
        var mode = M(spelling);
        var top = Table(("note", Col(mode, "deck")));
        var bottom = Table(("note", Col(mode, 7)));
        var a = Appending.Append(top, bottom, mode);
        Assert.Equal("object", a["note"].TypeLabel);
        Assert.Equal([Value.Of("deck"), Value.Of(7L)], Values(a["note"]));
    }

    [Theory]
    [InlineData("modern")]
    [InlineData("arrow+nan+alias")]
    public void Different_types_are_an_error_under_arrow(string spelling)
    {
        var mode = M(spelling);
        var top = Table(("note", Col(mode, "deck")));
        var bottom = Table(("note", Col(mode, 7)));
        var e = Assert.Throws<EngineException>(() => Appending.Append(top, bottom, mode));
        Assert.Equal(ErrorCodes.Type, e.Code);
        Assert.Contains("'note'", e.Message, StringComparison.Ordinal);
        Assert.Contains("utf8", e.Message, StringComparison.Ordinal);
        Assert.Contains("int64", e.Message, StringComparison.Ordinal);
    }

    // Spec §2.1: a bool column with missing is object under nan and bool with nulls under null.
    [Theory]
    [InlineData("legacy", "object")]
    [InlineData("arrow+nan+cow", "object")]
    [InlineData("modern", "bool")]
    public void Bool_filled_with_missing_is_normalised(string spelling, string type)
    {
        var mode = M(spelling);
        var top = Table(("refund", Col(mode, true)));
        var bottom = Table(("other", Col(mode, 1)));
        Assert.Equal(type, Appending.Append(top, bottom, mode)["refund"].TypeLabel);
    }

    // A side whose cells are all missing takes the other side's type (documented choice).
    [Fact]
    public void All_missing_side_takes_the_other_type_under_arrow()
    {
        var mode = Parity.Engine.Modes.Mode.Modern;
        var top = Table(("note", Col(mode, 1.5)));
        top = new Parity.Engine.Frames.Table(["note"], [ColumnOfMissingFloats(mode)], 2);
        var bottom = Table(("note", Col(mode, "deck")));
        var a = Appending.Append(top, bottom, mode);
        Assert.Equal("utf8", a["note"].TypeLabel);
        Assert.Equal([Value.Null, Value.Null, Value.Of("deck")], Values(a["note"]));
    }

    private static Parity.Engine.Columns.Column ColumnOfMissingFloats(Parity.Engine.Modes.Mode mode) =>
        Parity.Engine.Columns.ColumnFactory.FromValues([Value.Null, Value.Null], mode, Parity.Engine.Columns.ColumnType.Float64);
}
