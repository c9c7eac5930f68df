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
    public void Type_changing_write_through_a_view_gives_the_view_its_own_column()
    {
        // docs/semantics.md: under alias a write that changes the column's type (here a string into an int64
        // column under boxed) gives the writing frame its own column of the new type; the parent keeps its column
        // unchanged, and the other column stays shared. (Library the modes model, from memory: the view's block is
        // upcast on its own.)
        var mode = Mode.Legacy;
        var parent = Tickets(mode);
        var view = parent.View(0, 2);
        var outcome = view.Write("fare", ColumnFactory.FromValues([Value.Of("free"), Value.Of(-5L)], mode), mode);
        Assert.Null(outcome.Before);
        Assert.Equal("object", view.GetColumn("fare").TypeLabel);
        Assert.Equal(Value.Of("free"), view.GetColumn("fare").GetValue(0));
        Assert.Equal("int64", parent.GetColumn("fare").TypeLabel);
        Assert.Equal(Value.Of(12L), parent.GetColumn("fare").GetValue(0));
        Assert.NotSame(parent.Columns[0].Slot, view.Columns[0].Slot);
        Assert.Same(parent.Columns[1].Slot, view.Columns[1].Slot);
        // The other direction: the parent retypes its own column, the view keeps the old one.
        var p2 = Tickets(mode);
        var v2 = p2.View(1, 2);
        p2.Write("fare", ColumnFactory.FromValues([Value.Of(1.5), Value.Of(2.0), Value.Of(3.0), Value.Of(4.0)], mode), mode);
        Assert.Equal("float64", p2.GetColumn("fare").TypeLabel);
        Assert.Equal("int64", v2.GetColumn("fare").TypeLabel);
        Assert.Equal(Value.Of(-5L), v2.GetColumn("fare").GetValue(0));
        // A same-type write still splices into the shared slot.
        v2.Write("passenger", ColumnFactory.FromValues([Value.Of("x"), Value.Of("y")], mode), mode);
        Assert.Equal(Value.Of("x"), p2.GetColumn("passenger").GetValue(1));
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
