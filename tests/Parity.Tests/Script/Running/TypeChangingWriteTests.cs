using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Script.Running;

/// <summary>
/// docs/semantics.md, "A write that changes the column's type": under <c>alias</c> such a write gives the written
/// frame its own column of the new type; the other frames keep theirs unchanged and still share it; the frames'
/// other columns stay shared. Both directions (view to parent, parent to view), through <c>take</c>, <c>skip</c>,
/// <c>column</c>, views of views and chained writes. Expected values: common practice of the library the modes
/// model (its copy-off configuration: the written frame's block is upcast on its own), from memory.
/// </summary>
public sealed class TypeChangingWriteTests
{
    public static TheoryData<string> AllModes()
    {
        var data = new TheoryData<string>();
        foreach (var m in Mode.All) data.Add(m.Spelling);
        return data;
    }

    // A missing value into an int64 column is a type change under nan only (int64 -> float64); under null the
    // column keeps its type and an alias write reaches the parent as any other write does.
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Missing_into_int64_through_a_view(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var run = Harbor.Ok("let v = tickets take 3\nset v.sailing_id = null where ticket_id = 1\ncheck v as 'v1'\ncheck tickets as 't1'\n"
            + "set v.fare = 0 where ticket_id = 2\nset v.sailing_id = 5 where ticket_id = 3\nset tickets.sailing_id = 7 where ticket_id = 3\n"
            + "check v\ncheck tickets", mode);
        var v1 = run.Check("v1");
        var t1 = run.Check("t1");
        var retyped = mode.IsAlias && mode.IsNan;
        if (mode.IsNan)
        {
            Assert.Equal("float64", v1.Type("sailing_id"));
            Assert.Equal([Value.NaN, Value.Of(10.0), Value.Of(11.0)], v1.Col("sailing_id"));
        }
        else
        {
            Assert.Equal("int64", v1.Type("sailing_id"));
            Assert.Equal([Value.Null, Value.Of(10L), Value.Of(11L)], v1.Col("sailing_id"));
        }
        // The parent: unchanged when the write retyped (alias+nan) or when nothing is shared (cow).
        if (mode.IsAlias && mode.IsNull) Assert.Equal(Value.Null, t1.Col("sailing_id")[0]);
        else
        {
            Assert.Equal("int64", t1.Type("sailing_id"));
            Assert.Equal([Value.Of(10L), Value.Of(10L), Value.Of(11L), Value.Of(11L), Value.Of(12L)], t1.Col("sailing_id"));
        }
        Assert.Equal(mode.IsAlias && mode.IsNull ? ["tickets", "v"] : ["v"], run.Writes[0].ChangedFrames);
        // A later same-type write through v into another column still reaches tickets under alias.
        Assert.Equal(mode.IsAlias ? ["tickets", "v"] : ["v"], run.Writes[1].ChangedFrames);
        Assert.Equal(mode.IsAlias ? Value.Of(0.0) : Value.Of(12.0), run.Check("tickets").Col("fare")[1]);
        // Writes into the column that stopped being shared stay on their side.
        Assert.Equal(retyped || mode.IsCow ? ["v"] : ["tickets", "v"], run.Writes[2].ChangedFrames);
        Assert.Equal(retyped || mode.IsCow ? ["tickets"] : ["tickets", "v"], run.Writes[3].ChangedFrames);
        Assert.DoesNotContain(run.Warnings, w => w.Code == ErrorCodes.MaybeCopy);
    }

    // Parent to view: null into the parent's bool column under nan makes the parent's column object; the view keeps
    // its bool column; the fare column stays shared both ways.
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Missing_into_bool_through_the_parent(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var run = Harbor.Ok("let v = tickets skip 2\nset tickets.is_child = null where ticket_id = 3\ncheck v as 'v1'\n"
            + "set tickets.fare = 1 where ticket_id = 4\ncheck v\ncheck tickets", mode);
        var v1 = run.Check("v1");
        var tickets = run.Check("tickets");
        Assert.Equal(mode.IsNan ? "object" : "bool", tickets.Type("is_child"));
        Assert.Equal(mode.IsNan ? Value.NaN : Value.Null, tickets.Col("is_child")[2]);
        if (mode.IsAlias && mode.IsNull)
        {
            Assert.Equal(Value.Null, v1.Col("is_child")[0]);
            Assert.Equal(["tickets", "v"], run.Writes[0].ChangedFrames);
        }
        else
        {
            Assert.Equal("bool", v1.Type("is_child"));
            Assert.Equal([Value.Of(false), Value.Of(false), Value.Of(false)], v1.Col("is_child"));
            Assert.Equal(["tickets"], run.Writes[0].ChangedFrames);
        }
        Assert.Equal(mode.IsAlias ? ["tickets", "v"] : ["tickets"], run.Writes[1].ChangedFrames);
        Assert.Equal(mode.IsAlias ? Value.Of(1.0) : Value.Of(-24.5), run.Check("v").Col("fare")[1]);
    }

    // A string into a number column through `column c`: a type change under boxed (float64 -> object); under
    // arrow it is E-TYPE-WRITE (docs/semantics.md, "Typed writes").
    [Theory]
    [MemberData(nameof(AllModes))]
    public void String_into_a_number_column_through_column(string spelling)
    {
        var mode = Mode.Parse(spelling);
        const string script = "let c = tickets column fare\nset c.fare = 'free' where fare < 0\ncheck c\ncheck tickets";
        if (mode.IsArrow)
        {
            Harbor.Fails(script, mode, ErrorCodes.TypeWrite);
            return;
        }
        var run = Harbor.Ok(script, mode);
        Assert.Equal("object", run.Check("c").Type("fare"));
        Assert.Equal(Value.Of("free"), run.Check("c").Col("fare")[3]);
        Assert.Equal("float64", run.Check("tickets").Type("fare"));
        Assert.Equal(Value.Of(-24.5), run.Check("tickets").Col("fare")[3]);
        Assert.Equal(["c"], run.Writes[0].ChangedFrames);
    }

    // A float into an int64 column is a type change in every mode (int64 -> float64).
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Float_into_int64_through_skip(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var run = Harbor.Ok("let v = tickets skip 3\nset v.ticket_id = 4.5 where ticket_id = 4\ncheck v\ncheck tickets", mode);
        Assert.Equal("float64", run.Check("v").Type("ticket_id"));
        Assert.Equal([Value.Of(4.5), Value.Of(5.0)], run.Check("v").Col("ticket_id"));
        Assert.Equal("int64", run.Check("tickets").Type("ticket_id"));
        Assert.Equal(Value.Of(4L), run.Check("tickets").Col("ticket_id")[3]);
        Assert.Equal(["v"], run.Writes[0].ChangedFrames);
    }

    // Views of views: b (a view of a, itself a view of tickets) retypes its own column; a and tickets keep theirs
    // and still share it; a chained write through a view that retypes reaches nothing.
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Views_of_views_and_chained_writes(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var run = Harbor.Ok("let a = tickets take 4\nlet b = a skip 1\nset b.sailing_id = null where ticket_id = 2\n"
            + "set a.sailing_id = 9 where ticket_id = 4\nset (tickets take 3).lot = null where ticket_id = 1\n"
            + "set (tickets skip 1 take 2).sailing_id = null where ticket_id = 3\ncheck a\ncheck b\ncheck tickets", mode);
        var retyped = mode.IsAlias && mode.IsNan;
        var alias = mode.IsAlias;
        Assert.Equal(retyped || !alias ? ["b"] : ["a", "b", "tickets"], run.Writes[0].ChangedFrames);
        Assert.Equal(retyped ? ["a", "tickets"] : alias ? ["a", "b", "tickets"] : ["a"], run.Writes[1].ChangedFrames);
        // A new column through a chained view never reaches the parent (docs/semantics.md, "A new column on a view").
        Assert.Empty(run.Writes[2].ChangedFrames);
        Assert.Equal(-1, run.Check("tickets").IndexOf("lot"));
        // The chained type-changing write: the temporary gets its own column, tickets is untouched.
        Assert.Equal(alias && mode.IsNull ? ["a", "b", "tickets"] : [], run.Writes[3].ChangedFrames);
        var tickets = run.Check("tickets");
        Assert.Equal("int64", tickets.Type("sailing_id"));
        Assert.Equal(alias && mode.IsNull ? Value.Null : Value.Of(10L), tickets.Col("sailing_id")[1]);
        Assert.Equal(alias && mode.IsNull ? Value.Null : Value.Of(11L), tickets.Col("sailing_id")[2]);
        Assert.Equal(alias ? Value.Of(9L) : Value.Of(11L), tickets.Col("sailing_id")[3]);
        var b = run.Check("b");
        Assert.Equal(mode.IsNan ? "float64" : "int64", b.Type("sailing_id"));
        Assert.True(b.Col("sailing_id")[0].IsMissing);
        Assert.Equal(retyped || !alias ? 11.0 : 9.0, b.Col("sailing_id")[2].AsDouble);
    }
}
