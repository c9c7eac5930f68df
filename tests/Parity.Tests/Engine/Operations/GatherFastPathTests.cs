using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.Operations;

/// <summary>Gathers without a validity bitmap, Arrow string gathers from slices, and the join that keeps left columns.</summary>
public sealed class GatherFastPathTests
{
    private static Utf8Column Strings(params string?[] cells)
    {
        var b = new Utf8ColumnBuilder(cells.Length, 16);
        foreach (var c in cells)
        {
            if (c is null) b.AppendMissing();
            else b.Append(c);
        }
        return b.Build(MissingMarker.Null);
    }

    // Arrow columnar format: a slice keeps absolute offsets into its parent's data and a bitmap that starts
    // mid-byte; gathered rows (with -1 for a missing row) must read the right bytes and validity.
    [Fact]
    public void Utf8_gather_from_a_slice_with_missing_rows()
    {
        string?[] cells = ["Zoë", null, "", "Σοφία", "山田", null, "🚢 ferry", "x", "", "Åsa", "last"];
        var slice = (Utf8Column)Strings(cells).Slice(3, 7); // Σοφία 山田 null 🚢 ferry x "" Åsa
        var t = new Table(["name"], [slice], 7);
        var g = TableOps.Gather(t, [6, -1, 2, 0, 4, 3, 1, 5, 6, 6, 0, 4, 2, 1, 3, 5], Mode.Modern)["name"];
        string?[] expected = ["Åsa", null, null, "Σοφία", "x", "🚢 ferry", "山田", "", "Åsa", "Åsa", "Σοφία", "x", null, "山田", "🚢 ferry", ""];
        Assert.Equal(expected.Length, g.Length);
        for (var i = 0; i < expected.Length; i++)
        {
            if (expected[i] is null) Assert.True(g.IsMissing(i), "row " + i);
            else Assert.Equal(Value.Of(expected[i]!), g.GetValue(i));
        }
        Assert.Equal(3, g.MissingCount);
    }

    // Spec §2.1: a -1 row in a column without a bitmap becomes missing (null under null modes).
    [Fact]
    public void Primitive_gather_without_bitmap_marks_minus_one_rows()
    {
        var c = new Int64Column(new long[] { 10, 20, 30, 40, 50, 60, 70, 80, 90 }, MissingMarker.Null);
        var g = c.Slice(1, 8).Gather([7, -1, 0, 3, -1, 6, 2, 1, 5]);
        Assert.Equal([Value.Of(90L), Value.Null, Value.Of(20L), Value.Of(50L), Value.Null, Value.Of(80L), Value.Of(40L), Value.Of(30L), Value.Of(70L)],
            Enumerable.Range(0, g.Length).Select(g.GetValue).ToArray());
    }

    // Spec §2.3: an inner join keeps left rows in order; when each left row matches once, the left columns
    // come through unchanged (shared, as columns are immutable), and a left row without a match still drops.
    [Fact]
    public void Join_with_one_match_per_left_row_keeps_left_columns()
    {
        var mode = Mode.Modern;
        var left = new Table(["route", "fare"], [new Int64Column(new long[] { 2, 1, 2, 3 }, mode.Missing), Strings("a", "b", "c", "d")], 4);
        var right = new Table(["route", "km"], [new Int64Column(new long[] { 3, 2, 1 }, mode.Missing), new Float64Column(new[] { 3.5, 2.5, 1.5 }, mode.Missing)], 3);
        var j = Joining.Join(left, right, "route", "route", leftOuter: false, mode, long.MaxValue);
        Assert.Same(left.Columns[1], j["fare"]);
        Assert.Equal([Value.Of(2.5), Value.Of(1.5), Value.Of(2.5), Value.Of(3.5)], Enumerable.Range(0, 4).Select(j["km"].GetValue).ToArray());

        var partial = new Table(["route", "km"], [new Int64Column(new long[] { 2 }, mode.Missing), new Float64Column(new[] { 2.5 }, mode.Missing)], 1);
        var k = Joining.Join(left, partial, "route", "route", leftOuter: false, mode, long.MaxValue);
        Assert.Equal([Value.Of("a"), Value.Of("c")], Enumerable.Range(0, k.RowCount).Select(k["fare"].GetValue).ToArray());
    }
}
