using FsCheck.Xunit;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using Parity.Engine.Values;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

public sealed class JoiningTests
{
    private static (Table Tickets, Table Sailings) Ferry(Mode mode) => (
        Table(
            ("ticket", Col(mode, 1, 2, 3, 4)),
            ("sailing", Col(mode, "S2", "S9", "S1", "S2")),
            ("fare", Col(mode, 12.5, 8.0, -3.0, 20.0))),
        Table(
            ("sailing", Col(mode, "S1", "S2", "S2", "S3")),
            ("boat", Col(mode, "Λίμνη", "Ørnen", "Ørnen II", "湖")),
            ("fare", Col(mode, 100, 200, 300, 400))));

    // Spec §2.3: join keeps left rows in order and, for each, the matching right rows in their order; the key
    // appears once; a clashing right column gets the suffix _2.
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Inner_join_keeps_left_order_then_right_order(string spelling)
    {
        var mode = M(spelling);
        var (tickets, sailings) = Ferry(mode);
        var j = Joining.Join(tickets, sailings, "sailing", "sailing", leftOuter: false, mode, 1000);
        Assert.Equal(["ticket", "sailing", "fare", "boat", "fare_2"], j.Names);
        Assert.Equal([Value.Of(1L), Value.Of(1L), Value.Of(3L), Value.Of(4L), Value.Of(4L)], Values(j["ticket"]));
        Assert.Equal([Value.Of("Ørnen"), Value.Of("Ørnen II"), Value.Of("Λίμνη"), Value.Of("Ørnen"), Value.Of("Ørnen II")], Values(j["boat"]));
        Assert.Equal("int64", j["fare_2"].TypeLabel);
    }

    // Spec §2.2: left-join rows without a match get missing right values, normalised per mode (§2.1: an int64
    // column with missing is float64 under nan).
    [Theory]
    [InlineData("legacy", "float64")]
    [InlineData("modern", "int64")]
    [InlineData("arrow+nan+cow", "float64")]
    [InlineData("boxed+null+alias", "int64")]
    public void Left_join_fills_unmatched_rows_with_missing(string spelling, string fareType)
    {
        var mode = M(spelling);
        var (tickets, sailings) = Ferry(mode);
        var j = Joining.Join(tickets, sailings, "sailing", "sailing", leftOuter: true, mode, 1000);
        Assert.Equal(6, j.RowCount);
        Assert.Equal([Value.Of(1L), Value.Of(1L), Value.Of(2L), Value.Of(3L), Value.Of(4L), Value.Of(4L)], Values(j["ticket"]));
        Assert.Equal(fareType, j["fare_2"].TypeLabel);
        Assert.Equal(Missing(mode), j["fare_2"].GetValue(2));
        Assert.True(j["boat"].IsMissing(2));
        Assert.Equal(Value.Of("S9"), j["sailing"].GetValue(2));
    }

    // Spec §2.2: a missing key matches another missing key under nan and never under null.
    [Theory]
    [InlineData("legacy", 3)]
    [InlineData("arrow+nan+alias", 3)]
    [InlineData("modern", 1)]
    [InlineData("boxed+null+cow", 1)]
    public void Missing_keys_match_under_nan_only(string spelling, int rows)
    {
        var mode = M(spelling);
        var left = Table(("route", Col(mode, "north", null)), ("a", Col(mode, 1, 2)));
        var right = Table(("route", Col(mode, null, "north", Value.NaN)), ("b", Col(mode, 10, 20, 30)));
        var j = Joining.Join(left, right, "route", "route", leftOuter: false, mode, 1000);
        Assert.Equal(rows, j.RowCount);
        Assert.Equal(Value.Of(20L), j["b"].GetValue(0));
        if (mode.IsNan) Assert.Equal([Value.Of(20L), Value.Of(10L), Value.Of(30L)], Values(j["b"]));
    }

    // Spec §2.2: an int64 key matches a float64 key of equal numeric value (under nan a key with missing is float64).
    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Int64_key_matches_float64_key_by_value(string spelling)
    {
        var mode = M(spelling);
        var left = Table(("deck", Col(mode, 1, 2, 3)));
        var right = Table(("level", Col(mode, 2.0, 2.5, null, 1.0)), ("name", Col(mode, "upper", "mid", "none", "lower")));
        Assert.Equal("int64", left["deck"].TypeLabel);
        Assert.Equal("float64", right["level"].TypeLabel);
        var j = Joining.Join(left, right, "deck", "level", leftOuter: false, mode, 1000);
        Assert.Equal(["deck", "name"], j.Names);
        Assert.Equal([Value.Of("lower"), Value.Of("upper")], Values(j["name"]));
        Assert.Equal([Value.Of(1L), Value.Of(2L)], Values(j["deck"]));
    }

    [Fact]
    public void Suffix_skips_names_already_taken()
    {
        var mode = Mode.Modern;
        var left = Table(("k", Col(mode, 1)), ("x", Col(mode, 1)), ("x_2", Col(mode, 2)));
        var right = Table(("k", Col(mode, 1)), ("x", Col(mode, 3)));
        Assert.Equal(["k", "x", "x_2", "x_3"], Joining.Join(left, right, "k", "k", false, mode, 10).Names);
    }

    // Our limit rule: a join that would exceed --max-rows fails before allocating, naming both numbers.
    [Fact]
    public void Row_limit_is_checked_before_allocation()
    {
        var mode = Mode.Legacy;
        var left = Table(("k", Col(mode, 1, 1, 1)));
        var right = Table(("k", Col(mode, 1, 1, 1, 1)), ("v", Col(mode, 1, 2, 3, 4)));
        var e = Assert.Throws<EngineException>(() => Joining.Join(left, right, "k", "k", false, mode, 11));
        Assert.Equal(ErrorCodes.Limit, e.Code);
        Assert.Equal("join would produce 12 rows, more than the limit of 11 (raise it with --max-rows)", e.Message);
        Assert.Equal(12, Joining.Join(left, right, "k", "k", false, mode, 12).RowCount);
    }

    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    public void Join_on_timestamps_and_bools(string spelling)
    {
        var mode = M(spelling);
        var day = new DateTime(2024, 7, 1, 6, 30, 0);
        var left = Table(("at", Col(mode, day, day.AddHours(1))), ("refund", Col(mode, true, false)));
        var right = Table(("at", Col(mode, day.AddHours(1), day)), ("refund", Col(mode, false, false)), ("boat", Col(mode, "b", "a")));
        Assert.Equal([Value.Of("a"), Value.Of("b")], Values(Joining.Join(left, right, "at", "at", false, mode, 10)["boat"]));
        Assert.Equal([Value.Of("b"), Value.Of("a")], Values(Joining.Join(left, right, "refund", "refund", false, mode, 10)["boat"]));
    }

    // Property: the hash join equals a nested-loop join (spec §2.3 row order; §2.2 missing keys match under
    // nan only), inner and left, with int64 keys on the left and float64 keys (with missing) on the right.
    [Property(MaxTest = 150)]
    public bool Hash_join_equals_nested_loop_join(int[] l, int[] r, bool modern, bool leftOuter)
    {
        var mode = modern ? Mode.Modern : Mode.Legacy;
        var lk = new object?[l.Length];
        var lid = new object?[l.Length];
        for (var i = 0; i < l.Length; i++) { lk[i] = l[i] % 6 == 0 ? null : l[i] % 4; lid[i] = i; }
        var rk = new object?[r.Length];
        var rid = new object?[r.Length];
        for (var i = 0; i < r.Length; i++) { rk[i] = r[i] % 5 == 0 ? null : (double)(r[i] % 4); rid[i] = i; }
        var left = Table(("k", Col(mode, lk)), ("id", Col(mode, lid)));
        var right = Table(("rk", Col(mode, rk)), ("id", Col(mode, rid)));
        var j = Joining.Join(left, right, "k", "rk", leftOuter, mode, 1_000_000);
        var expected = new List<(long, long?)>();
        for (var a = 0; a < l.Length; a++)
        {
            var matched = false;
            for (var b = 0; b < r.Length; b++)
            {
                var bothMissing = lk[a] is null && rk[b] is null;
                var equal = lk[a] is int x && rk[b] is double y && x == y;
                if (equal || (bothMissing && mode.IsNan)) { expected.Add((a, b)); matched = true; }
            }
            if (!matched && leftOuter) expected.Add((a, null));
        }
        if (j.RowCount != expected.Count) return false;
        for (var k = 0; k < expected.Count; k++)
        {
            if (j["id"].GetValue(k).Int64 != expected[k].Item1) return false;
            var right2 = j["id_2"].GetValue(k);
            if (expected[k].Item2 is long want ? right2.IsMissing || (long)right2.AsDouble != want : !right2.IsMissing) return false;
        }
        return true;
    }
}
