using FsCheck.Xunit;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using Parity.Engine.Values;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

public sealed class GroupingTests
{
    // Spec §2.2: grouping drops rows whose key is missing (counted); groups come out in ascending key order.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    [InlineData("arrow+nan+cow")]
    [InlineData("boxed+null+alias")]
    public void Groups_are_in_ascending_key_order_and_missing_keys_are_dropped(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("route", Col(mode, "south", null, "north", "south", "ferry ⛴", Value.NoneRef, Value.NaN)));
        var g = Grouping.Group(t, ["route"]);
        // "ferry ⛴" < "north" < "south"
        Assert.Equal(3, g.GroupCount);
        Assert.Equal([2, -1, 1, 2, 0, -1, -1], g.GroupOf);
        Assert.Equal([4, 2, 0], g.Representative);
        Assert.Equal(3, g.DroppedRows);
    }

    // Spec §2.2: a row is dropped when any of its keys is missing; ordering is by the first key, then the second.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Multi_key_groups_order_lexicographically(string spelling)
    {
        var mode = M(spelling);
        var t = Table(
            ("route", Col(mode, "south", "north", "south", "north", "north", "south")),
            ("deck", Col(mode, 2, 1, 1, null, 1, 2)));
        var g = Grouping.Group(t, ["route", "deck"]);
        // (north,1)=0, (south,1)=1, (south,2)=2
        Assert.Equal(3, g.GroupCount);
        Assert.Equal([2, 0, 1, -1, 0, 2], g.GroupOf);
        Assert.Equal([1, 2, 0], g.Representative);
        Assert.Equal(1, g.DroppedRows);
    }

    // Spec §2.1: a NaN produced by arithmetic is a value under null (one group, after the numbers) and missing under nan.
    [Theory]
    [InlineData("modern", 2, 0)]
    [InlineData("legacy", 1, 2)]
    public void NaN_is_a_group_under_null_and_dropped_under_nan(string spelling, int groups, int dropped)
    {
        var mode = M(spelling);
        var t = Table(("ratio", Col(mode, double.NaN, 1.0, double.NaN)));
        var g = Grouping.Group(t, ["ratio"]);
        Assert.Equal(groups, g.GroupCount);
        Assert.Equal(dropped, g.DroppedRows);
        Assert.Equal(0, g.GroupOf[1]);
    }

    // IEEE 754: -0.0 equals 0.0, so they are one key.
    [Fact]
    public void Negative_zero_groups_with_zero()
    {
        var t = Table(("fare", Col(Mode.Modern, 0.0, -0.0, 2.5)));
        Assert.Equal([0, 0, 1], Grouping.Group(t, ["fare"]).GroupOf);
    }

    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Bool_and_timestamp_keys_group_in_order(string spelling)
    {
        var mode = M(spelling);
        var t = Table(
            ("refund", Col(mode, true, false, true)),
            ("day", Col(mode, new DateTime(2024, 5, 2), new DateTime(2024, 5, 1), new DateTime(2024, 5, 2))));
        Assert.Equal([1, 0, 1], Grouping.Group(t, ["refund"]).GroupOf);
        Assert.Equal([1, 0, 1], Grouping.Group(t, ["day"]).GroupOf);
        Assert.Equal([1, 0, 1], Grouping.Group(t, ["day", "refund"]).GroupOf);
    }

    // Property: the group count equals the number of distinct non-missing keys; every kept row's group
    // holds rows with its key; group numbers rise with the key (spec §2.2).
    [Property(MaxTest = 200)]
    public bool Group_count_equals_distinct_non_missing_keys(int[] a, bool modern)
    {
        var mode = modern ? Mode.Modern : Mode.Legacy;
        var k1 = new object?[a.Length];
        var k2 = new object?[a.Length];
        for (var i = 0; i < a.Length; i++)
        {
            k1[i] = a[i] % 6 == 0 ? null : "r" + (a[i] % 3).ToString(System.Globalization.CultureInfo.InvariantCulture);
            k2[i] = a[i] % 5;
        }
        var t = Table(("route", Col(mode, k1)), ("deck", Col(mode, k2)));
        var g = Grouping.Group(t, ["route", "deck"]);
        var keys = new SortedSet<(string, int)>(Comparer<(string, int)>.Create((x, y) =>
            string.CompareOrdinal(x.Item1, y.Item1) is var c and not 0 ? c : x.Item2.CompareTo(y.Item2)));
        var dropped = 0;
        for (var i = 0; i < a.Length; i++)
        {
            if (k1[i] is null) { dropped++; continue; }
            keys.Add(((string)k1[i]!, (int)k2[i]!));
        }
        if (g.GroupCount != keys.Count || g.DroppedRows != dropped) return false;
        var ordered = keys.ToList();
        for (var i = 0; i < a.Length; i++)
        {
            if (k1[i] is null) { if (g.GroupOf[i] != -1) return false; continue; }
            if (ordered[g.GroupOf[i]] != ((string)k1[i]!, (int)k2[i]!)) return false;
        }
        return true;
    }

    [Fact]
    public void Single_group_holds_every_row()
    {
        var g = GroupIndex.Single(3);
        Assert.Equal(1, g.GroupCount);
        Assert.Equal([0, 0, 0], g.GroupOf);
        Assert.Equal(0, GroupIndex.Single(0).GroupCount);
    }
}
