using Parity.Engine.Errors;
using Parity.Engine.Operations;
using Parity.Engine.Values;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

public sealed class TableOpsTests
{
    // Spec §2.1/§2.2: a missing value in an int64 column makes it float64 (NaN) under nan, int64 with nulls under null;
    // a bool column becomes object under nan and stays bool under null.
    [Theory]
    [InlineData("legacy", "float64", "object", "object")]
    [InlineData("modern", "int64", "bool", "utf8")]
    [InlineData("arrow+nan+cow", "float64", "object", "utf8")]
    [InlineData("boxed+null+alias", "int64", "bool", "object")]
    public void Gather_with_minus_one_normalises_per_mode(string spelling, string intType, string boolType, string textType)
    {
        var mode = M(spelling);
        var t = Table(("seats", Col(mode, 40, 12)), ("open", Col(mode, true, false)), ("name", Col(mode, "Ἀθηνᾶ", "岸")));
        var g = TableOps.Gather(t, [1, -1, 0], mode);
        Assert.Equal(3, g.RowCount);
        Assert.Equal(intType, g["seats"].TypeLabel);
        Assert.Equal(boolType, g["open"].TypeLabel);
        Assert.Equal(textType, g["name"].TypeLabel);
        var seats = Values(g["seats"]);
        Assert.Equal(12.0, seats[0].AsDouble);
        Assert.True(seats[1].IsMissing);
        Assert.Equal(mode.IsNan ? MissingKind.NaN : MissingKind.Null, seats[1].Missing);
        Assert.Equal(40.0, seats[2].AsDouble);
        Assert.Equal(Value.Of("岸"), g["name"].GetValue(0));
        Assert.True(g["name"].IsMissing(1));
        Assert.True(g["open"].IsMissing(1));
        Assert.Equal(Value.Of(true), g["open"].GetValue(2));
    }

    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Gather_without_missing_keeps_types(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("seats", Col(mode, 40, 12, 7)));
        var g = TableOps.Gather(t, [2, 2, 0], mode);
        Assert.Equal("int64", g["seats"].TypeLabel);
        Assert.Equal([Value.Of(7L), Value.Of(7L), Value.Of(40L)], Values(g["seats"]));
    }

    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Filter_keeps_flagged_rows_in_order(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("fare", Col(mode, 12.5, -3.0, 8.0, 20.0)), ("who", Col(mode, "Zoë", "Ólafur", "Ελένη", "😀 Kai")));
        var f = TableOps.Filter(t, [true, false, false, true]);
        Assert.Equal(2, f.RowCount);
        Assert.Equal([Value.Of("Zoë"), Value.Of("😀 Kai")], Values(f["who"]));
    }

    // Spec §3.2: drop missing [c1, c2] drops rows with a missing value (any marker) in the listed columns, or in any column.
    [Theory]
    [InlineData("legacy", new[] { "age" }, new[] { 0, 2, 3 })]
    [InlineData("modern", new[] { "age" }, new[] { 0, 2, 3 })]
    [InlineData("legacy", new string[0], new[] { 0, 3 })]
    [InlineData("modern", new string[0], new[] { 0, 3 })]
    [InlineData("boxed+null+cow", new[] { "note" }, new[] { 0, 1, 3 })]
    [InlineData("arrow+nan+alias", new[] { "note", "age" }, new[] { 0, 3 })]
    public void DropMissing_drops_rows_with_any_missing_marker(string spelling, string[] columns, int[] keptIds)
    {
        var mode = M(spelling);
        var t = Table(
            ("id", Col(mode, 0, 1, 2, 3)),
            ("age", Col(mode, 31, null, 8, 64)),
            ("note", Col(mode, "window", "deck", Value.NoneRef, "bike")));
        var d = TableOps.DropMissing(t, columns);
        var ids = new List<long>();
        foreach (var v in Values(d["id"])) ids.Add(v.Int64);
        Assert.Equal(keptIds.Select(i => (long)i), ids);
    }

    [Fact]
    public void DropMissing_names_an_unknown_column()
    {
        var t = Table(("id", Col(Parity.Engine.Modes.Mode.Modern, 1)));
        var e = Assert.Throws<EngineException>(() => TableOps.DropMissing(t, ["fair"]));
        Assert.Equal(ErrorCodes.UnknownColumn, e.Code);
    }
}
