using FsCheck.Xunit;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using Parity.Engine.Values;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

public sealed class SortingTests
{
    // Spec §2.2 "Ordering": missing values sort last in both directions; ties keep input order (stable).
    [Theory]
    [InlineData("legacy", false, new[] { 2, 5, 0, 3, 1, 4 })]
    [InlineData("modern", false, new[] { 2, 5, 0, 3, 1, 4 })]
    [InlineData("legacy", true, new[] { 0, 3, 5, 2, 1, 4 })]
    [InlineData("modern", true, new[] { 0, 3, 5, 2, 1, 4 })]
    [InlineData("boxed+null+alias", true, new[] { 0, 3, 5, 2, 1, 4 })]
    [InlineData("arrow+nan+cow", false, new[] { 2, 5, 0, 3, 1, 4 })]
    public void Missing_sorts_last_in_both_directions_and_ties_are_stable(string spelling, bool descending, int[] expected)
    {
        var mode = M(spelling);
        var t = Table(("age", Col(mode, 3, null, 1, 3, null, 2)));
        Assert.Equal(expected, Sorting.Permutation(t, [new SortKey("age", descending)]));
    }

    // Spec §2.2 "Ordering": multi-key, stable; the second key orders rows tied on the first.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    [InlineData("arrow+nan+alias")]
    [InlineData("boxed+null+cow")]
    public void Multi_key_sort_orders_by_each_key_in_turn(string spelling)
    {
        var mode = M(spelling);
        var t = Table(
            ("route", Col(mode, "north", "south", "north", null, "south", "north")),
            ("fare", Col(mode, 12.5, 8.0, null, 4.0, 8.0, 30.0)));
        var perm = Sorting.Permutation(t, [new SortKey("route", false), new SortKey("fare", true)]);
        // north: 30.0 (5), 12.5 (0), missing (2); south: 8.0 (1), 8.0 (4) tie keeps order; missing route last.
        Assert.Equal([5, 0, 2, 1, 4, 3], perm);
    }

    // Unicode Standard §5.17 binary order / §2.5 UTF-8: code point order puts U+E000 < U+FFFD < U+1F600,
    // while UTF-16 ordinal order would put U+1F600 (surrogates D83D DE00) before U+E000. Both storages agree.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    [InlineData("arrow+nan+alias")]
    [InlineData("boxed+null+cow")]
    public void Strings_sort_in_code_point_order_not_utf16_order(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("name", Col(mode, "😀", "\uFFFD", "Zoë", "\uE000", "Ελένη", "岸本", "Zoe")));
        var perm = Sorting.Permutation(t, [new SortKey("name", false)]);
        // "Zoe" < "Zoë" (U+0065 < U+00EB) < Greek < CJK < U+E000 < U+FFFD < U+1F600
        Assert.Equal([6, 2, 4, 5, 3, 1, 0], perm);
        Assert.True(string.CompareOrdinal("😀", "\uE000") < 0); // .NET ordinal (UTF-16) order differs: the reason for the rule
    }

    // Spec §2.1: under null a NaN produced by arithmetic is a value; our documented order puts it after every
    // number and before missing, in both directions (common practice, no source).
    [Theory]
    [InlineData(false, new[] { 3, 0, 1, 2 })]
    [InlineData(true, new[] { 0, 3, 1, 2 })]
    public void NaN_value_sorts_after_numbers_before_missing_under_null(bool descending, int[] expected)
    {
        var mode = Mode.Modern;
        var t = Table(("ratio", Col(mode, 1.0, double.NaN, null, -1.0)));
        Assert.Equal(expected, Sorting.Permutation(t, [new SortKey("ratio", descending)]));
    }

    [Fact]
    public void NaN_is_missing_under_nan_and_sorts_last()
    {
        var mode = Mode.Legacy;
        var t = Table(("ratio", Col(mode, 1.0, double.NaN, -0.0, 0.0, -1.0)));
        // IEEE 754: -0.0 == 0.0, so the two zeros tie and keep input order.
        Assert.Equal([4, 2, 3, 0, 1], Sorting.Permutation(t, [new SortKey("ratio", false)]));
    }

    // Spec §2.2: bools false < true; timestamps by instant (ISO 8601, UTC).
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Bools_and_timestamps_sort_by_value(string spelling)
    {
        var mode = M(spelling);
        var t = Table(
            ("refund", Col(mode, true, false, true, false)),
            ("sailed", Col(mode, new DateTime(2024, 6, 1, 9, 0, 0), new DateTime(2023, 12, 31, 23, 59, 59), new DateTime(1969, 7, 20, 20, 17, 0), null)));
        Assert.Equal([1, 3, 0, 2], Sorting.Permutation(t, [new SortKey("refund", false)]));
        Assert.Equal([2, 1, 0, 3], Sorting.Permutation(t, [new SortKey("sailed", false)]));
        Assert.Equal([0, 1, 2, 3], Sorting.Permutation(t, [new SortKey("sailed", true)]));
    }

    // Ordering a mixed (object) column is E-TYPE, as comparing its cells with < is (library the modes model, from
    // memory: Python refuses to order str and int). Grouping still numbers the groups of such a column in our
    // documented order: numbers < bools < strings < timestamps (no source).
    [Theory]
    [InlineData("legacy")]
    [InlineData("boxed+null+cow")]
    public void Mixed_columns_cannot_be_ordered_but_group_by_kind_then_value(string spelling)
    {
        var mode = M(spelling);
        var t = Table(("x", Col(mode, "b", 2, true, 1.5, null, "a", new DateTime(2024, 1, 1), -7)));
        Assert.Equal("object", t["x"].TypeLabel);
        var e = Assert.Throws<EngineException>(() => Sorting.Permutation(t, [new SortKey("x", false)]));
        Assert.Equal(ErrorCodes.Type, e.Code);
        Assert.Equal("cannot order column 'x': it mixes strings (row 0) and numbers (row 1), which do not compare", e.Message);
        Assert.Equal(ErrorCodes.Type, Assert.Throws<EngineException>(() => Sorting.Permutation(t, [new SortKey("x", true)], 2)).Code);
        var groups = Grouping.Group(t, ["x"]);
        Assert.Equal([7, 3, 1, 2, 5, 0, 6], groups.Representative);
        // int64 and float64 cells are one kind: they order numerically, missing last.
        var numbers = Table(("x", new ObjectColumn(new object?[] { 2L, 1.5, null, -7L }, mode.Missing)));
        Assert.Equal([3, 1, 0, 2], Sorting.Permutation(numbers, [new SortKey("x", false)]));
    }

    [Fact]
    public void Unknown_sort_column_is_an_error()
    {
        var t = Table(("fare", Col(Mode.Modern, 1.0)));
        Assert.Equal(ErrorCodes.UnknownColumn, Assert.Throws<EngineException>(() => Sorting.Permutation(t, [new SortKey("fair", false)])).Code);
    }

    [Fact]
    public void Large_sparse_int64_keys_sort_correctly()
    {
        var mode = Mode.Modern;
        var t = Table(("k", Col(mode, long.MaxValue, long.MinValue, 0L, -5L, long.MaxValue, 1L << 40)));
        Assert.Equal([1, 3, 2, 5, 0, 4], Sorting.Permutation(t, [new SortKey("k", false)]));
    }

    // Property (common practice, no source): the result is a permutation, ordered by the key with missing last,
    // and stable (equal keys keep ascending row indices).
    [Property(MaxTest = 200)]
    public bool Permutation_is_a_stable_sorted_permutation(int[] raw, bool descending, bool modern)
    {
        var mode = modern ? Mode.Modern : Mode.Legacy;
        var cells = new object?[raw.Length];
        for (var i = 0; i < raw.Length; i++) cells[i] = raw[i] % 5 == 0 ? null : raw[i] % 7;
        var t = Table(("k", Col(mode, cells)));
        var perm = Sorting.Permutation(t, [new SortKey("k", descending)]);
        if (perm.Length != raw.Length || perm.Distinct().Count() != raw.Length) return false;
        for (var j = 1; j < perm.Length; j++)
        {
            var a = cells[perm[j - 1]];
            var b = cells[perm[j]];
            int cmp;
            if (a is null) cmp = b is null ? 0 : 1;
            else if (b is null) cmp = -1;
            else cmp = descending ? ((int)b).CompareTo((int)a) : ((int)a).CompareTo((int)b);
            if (cmp > 0) return false;
            if (cmp == 0 && perm[j - 1] > perm[j]) return false;
        }
        return true;
    }

    // Property: the single-key fast path (radix sort) and the general multi-key path (ranks) agree, with
    // NaN values, missing cells, -0.0 and both directions (spec §2.2 "Ordering").
    [Property(MaxTest = 200)]
    public bool Single_key_fast_path_matches_general_path(int[] raw, bool descending, bool modern, bool floats)
    {
        var mode = modern ? Mode.Modern : Mode.Legacy;
        var cells = new object?[raw.Length];
        var same = new object?[raw.Length];
        for (var i = 0; i < raw.Length; i++)
        {
            var r = raw[i];
            same[i] = 1;
            if (r % 9 == 0) cells[i] = null;
            else if (!floats) cells[i] = (long)r * 1_000_003L;
            else cells[i] = r % 7 == 0 ? double.NaN : r % 5 == 0 ? -0.0 : (r % 4) / 3.0;
        }
        var t = Table(("k", Col(mode, cells)), ("c", Col(mode, same)));
        var fast = Sorting.Permutation(t, [new SortKey("k", descending)]);
        var general = Sorting.Permutation(t, [new SortKey("k", descending), new SortKey("c", false)]);
        return fast.SequenceEqual(general);
    }

    // Many distinct values take the radix-rank path (more than 65,536 distinct keys); it must agree with the
    // direct path and with a reference sort (IEEE 754 order for doubles, missing last).
    [Theory]
    [InlineData(false, false)]
    [InlineData(true, false)]
    [InlineData(false, true)]
    [InlineData(true, true)]
    public void Many_distinct_keys_sort_alike_on_every_path(bool floats, bool descending)
    {
        var mode = Mode.Modern;
        var rnd = new Random(7);
        var cells = new object?[70_000];
        var same = new object?[cells.Length];
        for (var i = 0; i < cells.Length; i++)
        {
            same[i] = 0;
            cells[i] = i % 1000 == 0 ? null : floats ? (object)((rnd.NextDouble() - 0.5) * 1e6) : rnd.NextInt64(long.MinValue, long.MaxValue);
        }
        var t = Table(("k", Col(mode, cells)), ("c", Col(mode, same)));
        var fast = Sorting.Permutation(t, [new SortKey("k", descending)]);
        var general = Sorting.Permutation(t, [new SortKey("c", false), new SortKey("k", descending)]);
        Assert.Equal(fast, general);
        var expected = Enumerable.Range(0, cells.Length).Where(i => cells[i] is not null)
            .OrderBy(i => cells[i], Comparer<object?>.Create((a, b) => descending ? Cmp(b!, a!) : Cmp(a!, b!)))
            .Concat(Enumerable.Range(0, cells.Length).Where(i => cells[i] is null));
        Assert.Equal(expected, fast);
        Assert.Equal(cells.Length / 1000, Grouping.Group(t, ["k"]).DroppedRows);
    }

    private static int Cmp(object a, object b) => a is double x ? x.CompareTo((double)b) : ((long)a).CompareTo((long)b);

    // Property: both string storages give the same order (spec §2.2: code point order in every mode).
    [Property(MaxTest = 200)]
    public bool Boxed_and_arrow_strings_sort_alike(string[] raw)
    {
        var cells = new object?[raw.Length];
        for (var i = 0; i < raw.Length; i++) cells[i] = raw[i] is null ? null : ToValidUtf16(raw[i]);
        var boxed = Sorting.Permutation(Table(("s", Col(Mode.Legacy, cells))), [new SortKey("s", false)]);
        var arrow = Sorting.Permutation(Table(("s", Col(Mode.Modern, cells))), [new SortKey("s", false)]);
        return boxed.SequenceEqual(arrow);
    }

    /// <summary>Lone surrogates cannot round-trip through UTF-8; replace them (Unicode §3.9 U+FFFD substitution).</summary>
    private static string ToValidUtf16(string s) => System.Text.Encoding.UTF8.GetString(System.Text.Encoding.UTF8.GetBytes(s));

    [Fact]
    public void Sort_of_empty_table_is_empty()
    {
        var t = Table(("k", Col(Mode.Legacy)));
        Assert.Empty(Sorting.Permutation(t, [new SortKey("k", false)]));
        Assert.Equal(Value.NaN, Col(Mode.Legacy, 1, null).GetValue(1));
    }
}
