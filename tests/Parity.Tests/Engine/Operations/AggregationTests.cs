using FsCheck.Xunit;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using Parity.Engine.Values;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

public sealed class AggregationTests
{
    /// <summary>Tickets of three routes: "north" (fare 10, 20, age missing), "south" (fare missing), "west".</summary>
    private static (Parity.Engine.Frames.Table Table, GroupIndex Groups) Tickets(Mode mode)
    {
        var t = Table(
            ("route", Col(mode, "north", "south", "north", "west", "north")),
            ("seats", Col(mode, 2, 1, 4, 3, 2)),
            ("age", Col(mode, 30, null, null, 7, 30)),
            ("fare", Col(mode, 10.5, null, -2.0, 4.0, 20.0)),
            ("name", Col(mode, "Zoë", null, "😀 Kai", "\uFFFD", "Ελένη")),
            ("refund", Col(mode, false, true, true, false, false)));
        return (t, Grouping.Group(t, ["route"]));
    }

    // Spec §2.3: count, count_distinct are int64; avg is float64; sum, min, max, first keep the column's type
    // in that mode (an int column with missing is float64 under nan, §2.1).
    [Theory]
    [InlineData("legacy", AggregateFunction.CountRows, null, "int64")]
    [InlineData("modern", AggregateFunction.CountRows, null, "int64")]
    [InlineData("legacy", AggregateFunction.Count, "age", "int64")]
    [InlineData("modern", AggregateFunction.Count, "name", "int64")]
    [InlineData("legacy", AggregateFunction.CountDistinct, "age", "int64")]
    [InlineData("modern", AggregateFunction.CountDistinct, "name", "int64")]
    [InlineData("legacy", AggregateFunction.Avg, "seats", "float64")]
    [InlineData("modern", AggregateFunction.Avg, "age", "float64")]
    [InlineData("legacy", AggregateFunction.Sum, "seats", "int64")]
    [InlineData("modern", AggregateFunction.Sum, "seats", "int64")]
    [InlineData("legacy", AggregateFunction.Sum, "age", "float64")]
    [InlineData("modern", AggregateFunction.Sum, "age", "int64")]
    [InlineData("legacy", AggregateFunction.Sum, "fare", "float64")]
    [InlineData("modern", AggregateFunction.Sum, "fare", "float64")]
    [InlineData("legacy", AggregateFunction.Min, "age", "float64")]
    [InlineData("modern", AggregateFunction.Min, "age", "int64")]
    [InlineData("legacy", AggregateFunction.Max, "name", "object")]
    [InlineData("modern", AggregateFunction.Max, "name", "utf8")]
    [InlineData("legacy", AggregateFunction.First, "refund", "bool")]
    [InlineData("modern", AggregateFunction.First, "refund", "bool")]
    [InlineData("legacy", AggregateFunction.First, "seats", "int64")]
    [InlineData("modern", AggregateFunction.First, "fare", "float64")]
    public void Result_types_per_mode(string spelling, AggregateFunction function, string? column, string type)
    {
        var mode = M(spelling);
        var (t, g) = Tickets(mode);
        var result = Aggregation.Aggregate(function, column is null ? null : t[column], g, mode);
        Assert.Equal(3, result.Length);
        Assert.Equal(type, result.TypeLabel);
    }

    // Spec §2.2: aggregates skip missing values; count(c) counts non-missing cells, count() counts rows.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Counts_skip_missing(string spelling)
    {
        var mode = M(spelling);
        var (t, g) = Tickets(mode);
        Assert.Equal([Value.Of(3L), Value.Of(1L), Value.Of(1L)], Values(Aggregation.Aggregate(AggregateFunction.CountRows, null, g, mode)));
        Assert.Equal([Value.Of(2L), Value.Of(0L), Value.Of(1L)], Values(Aggregation.Aggregate(AggregateFunction.Count, t["age"], g, mode)));
        Assert.Equal([Value.Of(1L), Value.Of(0L), Value.Of(1L)], Values(Aggregation.Aggregate(AggregateFunction.CountDistinct, t["age"], g, mode)));
        Assert.Equal([Value.Of(2L), Value.Of(1L), Value.Of(1L)], Values(Aggregation.Aggregate(AggregateFunction.CountDistinct, t["seats"], g, mode)));
    }

    // Spec §2.3: sum over no non-missing value is 0; min/max/first/avg of such a group is missing, normalised per mode.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    [InlineData("arrow+nan+cow")]
    [InlineData("boxed+null+alias")]
    public void Empty_groups_sum_to_zero_and_have_missing_extremes(string spelling)
    {
        var mode = M(spelling);
        var (t, g) = Tickets(mode);
        var missing = Missing(mode);
        var sumAge = Values(Aggregation.Aggregate(AggregateFunction.Sum, t["age"], g, mode));
        Assert.Equal(60.0, sumAge[0].AsDouble);
        Assert.Equal(0.0, sumAge[1].AsDouble);
        Assert.False(sumAge[1].IsMissing);
        Assert.Equal([Value.Of(28.5), Value.Of(0.0), Value.Of(4.0)], Values(Aggregation.Aggregate(AggregateFunction.Sum, t["fare"], g, mode)));
        Assert.Equal([Value.Of(-2.0), missing, Value.Of(4.0)], Values(Aggregation.Aggregate(AggregateFunction.Min, t["fare"], g, mode)));
        Assert.Equal([Value.Of(20.0), missing, Value.Of(4.0)], Values(Aggregation.Aggregate(AggregateFunction.Max, t["fare"], g, mode)));
        Assert.Equal([Value.Of(28.5 / 3), missing, Value.Of(4.0)], Values(Aggregation.Aggregate(AggregateFunction.Avg, t["fare"], g, mode)));
        var minAge = Values(Aggregation.Aggregate(AggregateFunction.Min, t["age"], g, mode));
        Assert.Equal(missing, minAge[1]);
        Assert.Equal(30.0, minAge[0].AsDouble);
    }

    // first = the first non-missing value of the group in row order (documented choice; common practice).
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void First_is_the_first_non_missing_value(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("k", Col(mode, 1, 1, 1, 2)), ("note", Col(mode, null, "deck", "bike", null)));
        var g = Grouping.Group(t, ["k"]);
        var first = Values(Aggregation.Aggregate(AggregateFunction.First, t["note"], g, mode));
        Assert.Equal(Value.Of("deck"), first[0]);
        Assert.True(first[1].IsMissing);
    }

    // Spec §2.2: min/max of strings in code point order (Unicode Standard binary order: U+1F600 sorts after U+FFFD).
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    [InlineData("arrow+nan+alias")]
    [InlineData("boxed+null+cow")]
    public void String_min_max_use_code_point_order(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("name", Col(mode, "\uFFFD", "😀", "\uE000", null)));
        var g = GroupIndex.Single(4);
        Assert.Equal(Value.Of("😀"), Aggregation.Aggregate(AggregateFunction.Max, t["name"], g, mode).GetValue(0));
        Assert.Equal(Value.Of("\uE000"), Aggregation.Aggregate(AggregateFunction.Min, t["name"], g, mode).GetValue(0));
    }

    // Spec §2.2: sum of a string column concatenates under boxed and is E-AGG-TYPE under arrow; §2.3: empty sum is ''.
    [Theory]
    [InlineData("legacy")]
    [InlineData("boxed+null+cow")]
    public void Sum_of_strings_concatenates_under_boxed(string spelling)
    {
        var mode = M(spelling);
        var (t, g) = Tickets(mode);
        var sum = Aggregation.Aggregate(AggregateFunction.Sum, t["name"], g, mode);
        Assert.Equal("object", sum.TypeLabel);
        Assert.Equal([Value.Of("Zoë😀 KaiΕλένη"), Value.Of(""), Value.Of("\uFFFD")], Values(sum));
    }

    [Theory]
    [InlineData("modern")]
    [InlineData("arrow+nan+alias")]
    public void Sum_of_strings_is_an_error_under_arrow(string spelling)
    {
        var mode = M(spelling);
        var (t, g) = Tickets(mode);
        var e = Assert.Throws<EngineException>(() => Aggregation.Aggregate(AggregateFunction.Sum, t["name"], g, mode));
        Assert.Equal(ErrorCodes.AggType, e.Code);
    }

    // Spec §2.3: int64 overflow is an error (E-OVERFLOW), in sums too.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Int64_sum_overflow_is_an_error(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("k", Col(mode, 1, 1)), ("v", Col(mode, long.MaxValue, 1L)));
        var e = Assert.Throws<EngineException>(() => Aggregation.Aggregate(AggregateFunction.Sum, t["v"], Grouping.Group(t, ["k"]), mode));
        Assert.Equal(ErrorCodes.Overflow, e.Code);
        var ok = Table(("k", Col(mode, 1, 2)), ("v", Col(mode, long.MaxValue, 1L)));
        Assert.Equal([Value.Of(long.MaxValue), Value.Of(1L)], Values(Aggregation.Aggregate(AggregateFunction.Sum, ok["v"], Grouping.Group(ok, ["k"]), mode)));
    }

    // Documented choice: a bool column sums to int64 (the number of true cells), common practice.
    [Fact]
    public void Bool_sum_counts_true_cells()
    {
        var mode = Mode.Modern;
        var (t, g) = Tickets(mode);
        var sum = Aggregation.Aggregate(AggregateFunction.Sum, t["refund"], g, mode);
        Assert.Equal([Value.Of(1L), Value.Of(1L), Value.Of(0L)], Values(sum));
    }

    // Spec §2.1: under null a NaN from arithmetic is a value: it is not skipped, so it propagates through sum
    // (IEEE 754) and is the max (our order puts it after every number); under nan it is missing and skipped.
    [Theory]
    [InlineData("modern", true)]
    [InlineData("legacy", false)]
    public void NaN_value_propagates_only_under_null(string spelling, bool propagates)
    {
        var mode = M(spelling);
        var t = Table(("x", Col(mode, 1.0, double.NaN, 2.0)));
        var g = GroupIndex.Single(3);
        var sum = Aggregation.Aggregate(AggregateFunction.Sum, t["x"], g, mode).GetValue(0);
        var max = Aggregation.Aggregate(AggregateFunction.Max, t["x"], g, mode).GetValue(0);
        var min = Aggregation.Aggregate(AggregateFunction.Min, t["x"], g, mode).GetValue(0);
        Assert.Equal(propagates, double.IsNaN(sum.Float64));
        Assert.Equal(propagates ? Value.Of(double.NaN) : Value.Of(2.0), max);
        Assert.Equal(Value.Of(1.0), min);
    }

    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Avg_of_strings_or_timestamps_is_an_error(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("name", Col(mode, "Zoë")), ("at", Col(mode, new DateTime(2024, 1, 1))));
        var g = GroupIndex.Single(1);
        Assert.Equal(ErrorCodes.AggType, Assert.Throws<EngineException>(() => Aggregation.Aggregate(AggregateFunction.Avg, t["name"], g, mode)).Code);
        Assert.Equal(ErrorCodes.AggType, Assert.Throws<EngineException>(() => Aggregation.Aggregate(AggregateFunction.Avg, t["at"], g, mode)).Code);
        Assert.Equal(ErrorCodes.AggType, Assert.Throws<EngineException>(() => Aggregation.Aggregate(AggregateFunction.Sum, t["at"], g, mode)).Code);
        Assert.Equal("timestamp", Aggregation.Aggregate(AggregateFunction.Max, t["at"], g, mode).TypeLabel);
    }

    // Spec §2.2: under nan an int64 result that gains a missing cell becomes float64 (NaN).
    [Fact]
    public void Int64_min_with_empty_group_widens_under_nan()
    {
        var ints = new Int64Column(new long[] { 5, 9 }, MissingMarker.Nan);
        var groups = new GroupIndex([0, 0], 2, [0, -1], 0);
        var legacy = Aggregation.Aggregate(AggregateFunction.Min, ints, groups, Mode.Legacy);
        Assert.Equal("float64", legacy.TypeLabel);
        Assert.Equal([Value.Of(5.0), Value.NaN], Values(legacy));
        var modernInts = new Int64Column(new long[] { 5, 9 }, MissingMarker.Null);
        var modern = Aggregation.Aggregate(AggregateFunction.Min, modernInts, groups, Mode.Modern);
        Assert.Equal("int64", modern.TypeLabel);
        Assert.Equal([Value.Of(5L), Value.Null], Values(modern));
    }

    // Property: grouped count/sum/min/max/first/count_distinct equal a direct per-key computation that skips
    // missing values (spec §2.2, §2.3), for string keys and int64 values with missing cells, in both presets.
    [Property(MaxTest = 150)]
    public bool Aggregates_match_a_reference(int[] raw, bool modern)
    {
        var mode = modern ? Mode.Modern : Mode.Legacy;
        var keys = new object?[raw.Length];
        var vals = new object?[raw.Length];
        for (var i = 0; i < raw.Length; i++)
        {
            keys[i] = raw[i] % 7 == 0 ? null : "λ" + (raw[i] % 3).ToString(System.Globalization.CultureInfo.InvariantCulture);
            vals[i] = raw[i] % 4 == 0 ? null : raw[i] / 3;
        }
        var t = Table(("k", Col(mode, keys)), ("v", Col(mode, vals)));
        var g = Grouping.Group(t, ["k"]);
        var sum = Values(Aggregation.Aggregate(AggregateFunction.Sum, t["v"], g, mode));
        var min = Values(Aggregation.Aggregate(AggregateFunction.Min, t["v"], g, mode));
        var max = Values(Aggregation.Aggregate(AggregateFunction.Max, t["v"], g, mode));
        var first = Values(Aggregation.Aggregate(AggregateFunction.First, t["v"], g, mode));
        var count = Values(Aggregation.Aggregate(AggregateFunction.Count, t["v"], g, mode));
        var distinct = Values(Aggregation.Aggregate(AggregateFunction.CountDistinct, t["v"], g, mode));
        var rows = Values(Aggregation.Aggregate(AggregateFunction.CountRows, null, g, mode));
        var groupKeys = keys.Where(k => k is not null).Select(k => (string)k!).Distinct().Order(StringComparer.Ordinal).ToList();
        if (g.GroupCount != groupKeys.Count) return false;
        for (var gi = 0; gi < groupKeys.Count; gi++)
        {
            var members = Enumerable.Range(0, raw.Length).Where(i => (string?)keys[i] == groupKeys[gi]).ToList();
            var present = members.Where(i => vals[i] is not null).Select(i => (long)(int)vals[i]!).ToList();
            if (rows[gi].Int64 != members.Count || count[gi].Int64 != present.Count) return false;
            if (distinct[gi].Int64 != present.Distinct().Count()) return false;
            if (sum[gi].AsDouble != present.Sum()) return false;
            if (present.Count == 0)
            {
                if (!min[gi].IsMissing || !max[gi].IsMissing || !first[gi].IsMissing) return false;
                continue;
            }
            if (min[gi].AsDouble != present.Min() || max[gi].AsDouble != present.Max() || first[gi].AsDouble != present[0]) return false;
        }
        return true;
    }
}
