using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Script.Running;

/// <summary>
/// Rules where the modes follow the library they model (docs/semantics.md): a missing value written into a
/// bool column, grouping by a bool column with missing values, lossy casts to int64, ordering a mixed boxed
/// column, aggregates over no value, and bool columns gaining missing values through fill, append and join.
/// Every rule runs in all eight modes. The expected values are the common practice of the library the modes
/// model, from memory (it is not a package this suite can run), unless a line says otherwise.
/// </summary>
public sealed class ReferenceRuleTests
{
    public static TheoryData<string> AllModes()
    {
        var data = new TheoryData<string>();
        foreach (var m in Mode.All) data.Add(m.Spelling);
        return data;
    }

    // A missing value set into a bool column upcasts it to object holding NaN under the NaN sentinel; None is
    // only ever the marker of string cells. Under the null marker the column stays bool with a null.
    // (Library the modes model, from memory.)
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Null_written_into_a_bool_column(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var t = Harbor.Ok("set tickets.is_child = null where ticket_id = 2\nset tickets.is_child = null where ticket_id = 3\n"
            + "set tickets.note = null where ticket_id = 1\ncheck tickets", mode).Check("tickets");
        var flags = t.Col("is_child");
        if (mode.IsNan)
        {
            Assert.Equal("object", t.Type("is_child"));
            // The second write goes into the column that is object already: still NaN, never None.
            Assert.Equal([Value.Of(false), Value.NaN, Value.NaN, Value.Of(false), Value.Of(false)], flags);
            // The neighbour that keeps None: the null literal in a boxed string cell (NaN under arrow+nan).
            Assert.Equal(mode.IsBoxed ? MissingKind.NoneRef : MissingKind.NaN, t.Col("note")[0].Missing);
        }
        else
        {
            Assert.Equal("bool", t.Type("is_child"));
            Assert.Equal([Value.Of(false), Value.Null, Value.Null, Value.Of(false), Value.Of(false)], flags);
            Assert.Equal(Value.Null, t.Col("note")[0]);
        }
        // A write of null into every row of a bool column.
        var all = Harbor.Ok("set tickets.is_child = null\ncheck tickets", mode).Check("tickets");
        Assert.Equal(mode.IsNan ? "object" : "bool", all.Type("is_child"));
        Assert.All(all.Col("is_child"), v => Assert.Equal(mode.IsNan ? Value.NaN : Value.Null, v));
    }

    // Grouping by a bool column with missing values (alone or with another key): the missing keys are dropped
    // and what is left are plain booleans, typed bool in every mode. (Library the modes model, from memory.)
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Group_by_a_bool_column_with_missing_values(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var run = Harbor.Ok("set tickets.is_child = null where ticket_id = 3\n"
            + "let g = tickets group by is_child compute n = count()\nlet h = tickets group by sailing_id, is_child compute n = count()\ncheck g\ncheck h", mode);
        var g = run.Check("g");
        Assert.Equal("bool", g.Type("is_child"));
        Assert.Equal([Value.Of(false), Value.Of(true)], g.Col("is_child"));
        Assert.Equal([Value.Of(3L), Value.Of(1L)], g.Col("n"));
        var h = run.Check("h");
        Assert.Equal("bool", h.Type("is_child"));
        Assert.Equal("int64", h.Type("sailing_id"));
        Assert.Equal([Value.Of(false), Value.Of(true), Value.Of(false), Value.Of(false)], h.Col("is_child"));
        Assert.Equal([Value.Of(10L), Value.Of(10L), Value.Of(11L), Value.Of(12L)], h.Col("sailing_id"));
        Assert.All(run.Notes, n => Assert.Equal(1, n.Count)); // ticket 3 dropped from each grouping
    }

    // cast to int64 of floats with a fractional part: truncation toward zero with the NaN sentinel (NumPy's
    // float-to-int conversion, C semantics); an error with the null marker, whose Arrow-backed integers refuse a
    // lossy cast. The error names the first such row, numbered from 0. (Library the modes model, from memory.)
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Cast_of_fractional_floats_to_int64(string spelling)
    {
        var mode = Mode.Parse(spelling);
        const string script = "let t = tickets cast fare to int64\ncheck t";
        if (mode.IsNan)
        {
            var t = Harbor.Ok(script, mode).Check("t");
            Assert.Equal("int64", t.Type("fare"));
            // 24.5, 12.0, 30.0, -24.5, 18.25: toward zero, so -24.5 is -24 (not -25).
            Assert.Equal([Value.Of(24L), Value.Of(12L), Value.Of(30L), Value.Of(-24L), Value.Of(18L)], t.Col("fare"));
        }
        else
        {
            var e = Harbor.Fails(script, mode, ErrorCodes.Cast);
            Assert.Equal("cannot cast 24.5 (row 0) to int64: it has a fractional part and the cast would lose it", e.Message);
            // The first lossy row, not the first row: rows 1 and 2 are whole numbers.
            var later = Harbor.Fails("let t = tickets skip 1 cast fare to int64", mode, ErrorCodes.Cast);
            Assert.Contains("-24.5 (row 2)", later.Message, StringComparison.Ordinal);
        }
        // Whole-valued floats convert in every mode.
        var whole = Harbor.Ok("let w = tickets where fare = 12.0 or fare = 30.0 cast fare to int64\ncheck w", mode).Check("w");
        Assert.Equal([Value.Of(12L), Value.Of(30L)], whole.Col("fare"));
    }

    // Ordering a boxed column that mixes numbers and strings is refused, as comparing them with < is. (Library
    // the modes model, from memory: Python refuses to order str and int.) Under arrow the write that would mix
    // them is already E-TYPE-WRITE.
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Order_by_a_mixed_boxed_column(string spelling)
    {
        var mode = Mode.Parse(spelling);
        const string write = "set tickets.note = 5 where ticket_id = 3\n";
        if (mode.IsArrow)
        {
            Harbor.Fails(write, mode, ErrorCodes.TypeWrite);
            return;
        }
        var e = Harbor.Fails(write + "let o = tickets order by note", mode, ErrorCodes.Type);
        Assert.Equal("cannot order column 'note': it mixes strings (row 0) and numbers (row 2), which do not compare", e.Message);
        Harbor.Fails(write + "let o = tickets order by ticket_id, note desc take 1", mode, ErrorCodes.Type);
        Harbor.Fails(write + "let c = tickets add x = note < 'a'", mode, ErrorCodes.Type);
        // The rows that hold the number only: one kind, orders fine; a string column with missing cells too.
        Assert.Equal(1, Harbor.Ok(write + "let o = tickets where ticket_id = 3 order by note\ncheck o", mode).Check("o").RowCount);
        Assert.Equal(5, Harbor.Ok("let o = tickets order by note\ncheck o", mode).Check("o").RowCount);
    }

    // Aggregates over no non-missing value: count and a numeric sum are 0, every other aggregate is missing:
    // NaN with the NaN sentinel whatever the column type (int64, bool, string: never None), null with the null
    // marker. (Library the modes model, from memory; docs/semantics.md, "Aggregates".)
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Aggregates_over_no_value(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var run = Harbor.Ok("set tickets.age = null where sailing_id = 12\nset tickets.fare = null where sailing_id = 12\n"
            + "set tickets.note = null where sailing_id = 12\nset tickets.is_child = null where sailing_id = 12\n"
            + "set tickets.ticket_id = null where sailing_id = 12\n"
            + "let g = tickets group by sailing_id compute n = count(), c = count(age), d = count_distinct(note), s = sum(age), sf = sum(fare), "
            + "si = sum(ticket_id), mn = min(age), mx = max(note), f = first(is_child), a = avg(fare), mi = max(ticket_id)\ncheck g", mode);
        var g = run.Check("g");
        Assert.Equal(3, g.RowCount);
        var missing = mode.IsNan ? Value.NaN : Value.Null;
        Assert.Equal(Value.Of(1L), g.Col("n")[2]);
        Assert.Equal(Value.Of(0L), g.Col("c")[2]);
        Assert.Equal(Value.Of(0L), g.Col("d")[2]);
        Assert.Equal(0.0, g.Col("s")[2].AsDouble);
        Assert.False(g.Col("s")[2].IsMissing);
        Assert.Equal(Value.Of(0.0), g.Col("sf")[2]);
        Assert.Equal(0.0, g.Col("si")[2].AsDouble);
        Assert.False(g.Col("si")[2].IsMissing);
        foreach (var name in new[] { "mn", "mx", "f", "a", "mi" }) Assert.Equal(missing, g.Col(name)[2]);
        // Types: under nan int64 and bool results that hold a missing value become float64 and object (§2.1).
        Assert.Equal(mode.IsNan ? "float64" : "int64", g.Type("mi"));
        Assert.Equal(mode.IsNan ? "object" : "bool", g.Type("f"));
        // Spec §2.3: the sum of a boxed string column over no value is the empty string; under arrow it is E-AGG-TYPE.
        const string strings = "set tickets.note = null where sailing_id = 12\nlet g = tickets group by sailing_id compute s = sum(note)\ncheck g";
        if (mode.IsBoxed) Assert.Equal(Value.Of(""), Harbor.Ok(strings, mode).Check("g").Col("s")[2]);
        else Harbor.Fails(strings, mode, ErrorCodes.AggType);
    }

    // A bool column gaining missing values through append and a left join follows §2.1: object with NaN under
    // nan, bool with null under null; fill that leaves no missing value makes it bool again. (Library the
    // modes model, from memory: concat and merge upcast bool to object with NaN; fillna keeps the values.)
    [Theory]
    [MemberData(nameof(AllModes))]
    public void Bool_columns_gaining_missing_values(string spelling)
    {
        var mode = Mode.Parse(spelling);
        var missing = mode.IsNan ? Value.NaN : Value.Null;
        var run = Harbor.Ok("let flags = tickets select ticket_id, is_child where ticket_id <= 2 rename ticket_id to sailing_id\n"
            + "let j = sailings join flags on sailing_id left\n"
            + "let a = sailings append flags\n"
            + "set tickets.is_child = null where ticket_id = 4\nlet f = tickets fill is_child with true\n"
            + "check j\ncheck a\ncheck f\ncheck tickets", mode);
        var j = run.Check("j");
        Assert.Equal(mode.IsNan ? "object" : "bool", j.Type("is_child"));
        Assert.Equal([missing, missing, missing], j.Col("is_child"));
        var a = run.Check("a");
        Assert.Equal(mode.IsNan ? "object" : "bool", a.Type("is_child"));
        Assert.Equal([missing, missing, missing, Value.Of(false), Value.Of(true)], a.Col("is_child"));
        Assert.Equal(mode.IsNan ? "object" : "bool", run.Check("tickets").Type("is_child"));
        var f = run.Check("f");
        Assert.Equal("bool", f.Type("is_child"));
        Assert.Equal([Value.Of(false), Value.Of(true), Value.Of(false), Value.Of(true), Value.Of(false)], f.Col("is_child"));
    }
}
