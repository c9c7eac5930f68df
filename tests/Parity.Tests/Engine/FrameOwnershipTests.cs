using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine;

public sealed class FrameOwnershipTests
{
    private static Frame Tickets(Mode mode) => Frame.FromTable(new Table(
        ["fare", "passenger"],
        [ColumnFactory.FromValues([Value.Of(12L), Value.Of(-5L), Value.Of(30L), Value.Of(8L)], mode),
         ColumnFactory.FromValues([Value.Of("Ána"), Value.Of("Νίκος"), Value.Of("美咲"), Value.Of("Ola 🚢")], mode)],
        4));

    private static Column Ints(Mode mode, params long[] v) => ColumnFactory.FromValues(Array.ConvertAll(v, Value.Of), mode);

    [Fact]
    public void Alias_row_view_writes_reach_the_parent_both_ways()
    {
        // Spec §2.2: under alias, take/skip produce views: a write to the view shows in the parent and back.
        var mode = Mode.Legacy;
        var parent = Tickets(mode);
        var view = parent.View(1, 2);
        view.Write("fare", Ints(mode, 0, 0), mode);
        Assert.Equal(Value.Of(0L), parent.GetColumn("fare").GetValue(1));
        Assert.Equal(Value.Of(12L), parent.GetColumn("fare").GetValue(0));
        parent.Write("fare", Ints(mode, 1, 2, 3, 4), mode);
        Assert.Equal(Value.Of(2L), view.GetColumn("fare").GetValue(0));
    }

    [Fact]
    public void Cow_derivations_share_columns_and_writes_stay_local()
    {
        // Spec §2.2: under cow every derived frame behaves as an independent copy; storage is shared until written.
        var mode = Mode.Modern;
        var parent = Tickets(mode);
        var derived = Frame.Derive(parent.Snapshot(), mode);
        Assert.Same(parent.GetColumn("passenger"), derived.GetColumn("passenger"));
        derived.Write("fare", Ints(mode, 0, 0, 0, 0), mode);
        Assert.Equal(Value.Of(12L), parent.GetColumn("fare").GetValue(0));
        Assert.Same(parent.GetColumn("passenger"), derived.GetColumn("passenger"));
    }

    [Fact]
    public void Alias_copies_are_eager()
    {
        // Spec §2.2: under alias every derivation other than views copies (defensive copies).
        var mode = Mode.Legacy;
        var parent = Tickets(mode);
        var derived = Frame.Derive(parent.Snapshot(), mode);
        Assert.NotSame(parent.GetColumn("passenger"), derived.GetColumn("passenger"));
        derived.Write("fare", Ints(mode, 0, 0, 0, 0), mode);
        Assert.Equal(Value.Of(12L), parent.GetColumn("fare").GetValue(0));
    }

    [Fact]
    public void New_column_on_an_alias_view_stays_in_the_view()
    {
        // Spec §2.2: adding a new column to a view under alias gives the view its own column.
        var mode = Mode.Legacy;
        var parent = Tickets(mode);
        var view = parent.View(0, 2);
        view.Write("discount", Ints(mode, 1, 1), mode);
        Assert.Equal(-1, parent.IndexOf("discount"));
        Assert.Equal(3, view.ColumnCount);
    }

    [Fact]
    public void Typed_write_through_a_boxed_view_changes_the_parent_type()
    {
        // Spec §2.2 / writes issue: a typed write into a view under boxed changes the parent's column type too.
        var mode = Mode.Legacy;
        var parent = Tickets(mode);
        var view = parent.View(0, 1);
        view.Write("fare", ColumnFactory.FromValues([Value.Of("free")], mode), mode);
        Assert.Equal("object", parent.GetColumn("fare").TypeLabel);
        Assert.Equal(Value.Of("free"), parent.GetColumn("fare").GetValue(0));
        Assert.Equal(Value.Of(-5L), parent.GetColumn("fare").GetValue(1));
    }

    [Fact]
    public void Snapshot_is_immune_to_later_alias_writes()
    {
        var mode = Mode.Legacy;
        var parent = Tickets(mode);
        var snap = parent.Snapshot();
        parent.View(0, 4).Write("fare", Ints(mode, 9, 9, 9, 9), mode);
        Assert.Equal(Value.Of(12L), snap["fare"].GetValue(0));
        Assert.Equal(Value.Of(9L), parent.GetColumn("fare").GetValue(0));
    }
}
