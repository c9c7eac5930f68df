using FsCheck.Xunit;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using Parity.Engine.Values;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

public sealed class DistinctTests
{
    // Spec §2.3: distinct keeps the first row of each distinct combination, in input order.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    [InlineData("arrow+nan+cow")]
    [InlineData("boxed+null+alias")]
    public void Keeps_first_row_of_each_combination_in_input_order(string spelling)
    {
        var mode = M(spelling);
        var t = Table(
            ("route", Col(mode, "south", "north", "south", "north", "south", null, null)),
            ("deck", Col(mode, 1, 2, 1, 1, 2, 3, 3)));
        Assert.Equal([0, 1, 3, 4, 5], Distinct.FirstRows(t, []));
        Assert.Equal([0, 1, 5], Distinct.FirstRows(t, ["route"]));
        Assert.Equal([0, 1, 5], Distinct.FirstRows(t, ["deck"]));
    }

    // Documented choice: missing equals missing of the same kind; a boxed None differs from a boxed NaN.
    [Fact]
    public void Boxed_none_and_nan_are_different_missing_kinds()
    {
        var mode = Mode.Legacy;
        var t = Table(("note", Col(mode, Value.NoneRef, Value.NaN, Value.NoneRef, "deck", Value.NaN)));
        Assert.Equal([0, 1, 3], Distinct.FirstRows(t, ["note"]));
    }

    // Under null a NaN from arithmetic is a value: one distinct NaN, apart from null (spec §2.1).
    [Fact]
    public void NaN_value_and_null_are_distinct_under_null()
    {
        var mode = Mode.Modern;
        var t = Table(("x", Col(mode, double.NaN, null, double.NaN, null, 0.0, -0.0)));
        Assert.Equal([0, 1, 4], Distinct.FirstRows(t, []));
    }

    // Property: distinct keeps exactly the first occurrence of each combination, in input order (spec §2.3).
    [Property(MaxTest = 200)]
    public bool First_rows_are_first_occurrences(int[] raw, bool modern)
    {
        var mode = modern ? Mode.Modern : Mode.Legacy;
        var a = new object?[raw.Length];
        var b = new object?[raw.Length];
        for (var i = 0; i < raw.Length; i++)
        {
            a[i] = raw[i] % 4 == 0 ? null : "Ø" + (raw[i] % 3).ToString(System.Globalization.CultureInfo.InvariantCulture);
            b[i] = raw[i] % 5 == 0 ? null : (raw[i] % 2) * 1.5;
        }
        var rows = Distinct.FirstRows(Table(("a", Col(mode, a)), ("b", Col(mode, b))), []);
        var seen = new HashSet<(object?, object?)>();
        var expected = new List<int>();
        for (var i = 0; i < raw.Length; i++)
            if (seen.Add((a[i], b[i]))) expected.Add(i);
        return rows.SequenceEqual(expected);
    }
}
