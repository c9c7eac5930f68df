using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Script.Running;

namespace Parity.Tests.Script.Running;

/// <summary>The rules of spec §2.2 and §2.3 run as scripts on the Harbor Line tickets (row 3 has no age; rows 2 and 4 no note).</summary>
public sealed class ModeRuleTests
{
    private static readonly Mode Legacy = Mode.Legacy;
    private static readonly Mode Modern = Mode.Modern;

    // Spec §2.2: length counts code points in every mode; int64 without missing input, float64 (nan) / int64 with nulls (null) with it.
    [Fact]
    public void Length()
    {
        foreach (var mode in new[] { Legacy, Modern, Harbor.ArrowNanCow })
        {
            var t = Harbor.Ok("let t = tickets add n = length(passenger), m = length(note)\ncheck t", mode).Check("t");
            Assert.Equal("int64", t.Type("n"));
            Assert.Equal(Value.Of(5L), t.Col("n")[3]); // "Ola 🚢"
            Assert.Equal(mode.IsNull ? "int64" : "float64", t.Type("m"));
            Assert.True(t.Col("m")[1].IsMissing);
        }
    }

    // Spec §2.2: comparisons with a missing operand: nan false (<> true), null null.
    [Fact]
    public void Comparisons_with_missing()
    {
        var legacy = Harbor.Ok("let t = tickets add gt = age > 30, ne = age <> 8\ncheck t", Legacy).Check("t");
        Assert.Equal(Value.Of(false), legacy.Col("gt")[2]);
        Assert.Equal(Value.Of(true), legacy.Col("ne")[2]);
        var modern = Harbor.Ok("let t = tickets add gt = age > 30, ne = age <> 8\ncheck t", Modern).Check("t");
        Assert.Equal(Value.Null, modern.Col("gt")[2]);
        Assert.Equal(Value.Null, modern.Col("ne")[2]);
    }

    // Spec §2.2: string predicates on a missing cell, and their use as a filter (E-MASK-MISSING under boxed+nan; null rows dropped and counted).
    [Fact]
    public void Predicates_and_filters()
    {
        var legacy = Harbor.Ok("let t = tickets add h = contains(note, 'bi')\ncheck t", Legacy).Check("t");
        Assert.Equal("object", legacy.Type("h"));
        Assert.True(legacy.Col("h")[1].IsMissing);
        var arrowNan = Harbor.Ok("let t = tickets add h = contains(note, 'bi')\ncheck t", Harbor.ArrowNanCow).Check("t");
        Assert.Equal("bool", arrowNan.Type("h"));
        Assert.Equal(Value.Of(false), arrowNan.Col("h")[1]);

        var failure = Harbor.Fails("let bikes = tickets where contains(note, 'bi')", Legacy, ErrorCodes.MaskMissing);
        Assert.Equal(3, failure.Span.LineNumber);
        Assert.Equal(1, Harbor.Ok("let bikes = tickets where contains(note, 'bi')\ncheck bikes", Harbor.ArrowNanCow).Check("bikes").RowCount);

        var modern = Harbor.Ok("let bikes = tickets where contains(note, 'bi')\ncheck bikes", Modern);
        Assert.Equal(1, modern.Check("bikes").RowCount);
        var note = Assert.Single(modern.Notes);
        Assert.Equal(RunNote.NullCondition, note.Kind);
        Assert.Equal(2, note.Count);
        // Spec §2.2: a row whose condition is null is not kept.
        var adults = Harbor.Ok("let a = tickets where age >= 18\ncheck a", Modern);
        Assert.Equal(3, adults.Check("a").RowCount);
        Assert.Equal(1, Assert.Single(adults.Notes).Count);
        Assert.Empty(Harbor.Ok("let a = tickets where age >= 18\ncheck a", Legacy).Notes);
    }

    // Spec §2.2: text(x): 'nan' under boxed+nan, missing elsewhere; concatenation with a missing operand is missing everywhere.
    [Fact]
    public void Text_and_concat()
    {
        foreach (var mode in new[] { Legacy, Modern, Harbor.ArrowNanCow, Harbor.BoxedNullAlias })
        {
            var t = Harbor.Ok("let t = tickets add s = text(note), f = text(fare), c = passenger || ': ' || note\ncheck t", mode).Check("t");
            if (mode.IsBoxed && mode.IsNan) Assert.Equal(Value.Of("nan"), t.Col("s")[1]);
            else Assert.True(t.Col("s")[1].IsMissing);
            Assert.Equal(Value.Of("12.0"), t.Col("f")[1]);
            Assert.True(t.Col("c")[1].IsMissing);
            Assert.Equal(Value.Of("Zoë Brandt: window seat"), t.Col("c")[0]);
            // Spec §2.2: cast to string follows the text rule.
            var c = Harbor.Ok("let t = tickets cast note to string\ncheck t", mode).Check("t");
            Assert.Equal(t.Col("s")[1], c.Col("note")[1]);
        }
    }

    // Spec §2.2: type_of gives the mode's label.
    [Fact]
    public void Type_of()
    {
        Assert.Equal(Value.Of("object"), Harbor.Ok("let t = tickets add k = type_of(passenger)\ncheck t", Legacy).Check("t").Col("k")[0]);
        Assert.Equal(Value.Of("utf8"), Harbor.Ok("let t = tickets add k = type_of(passenger)\ncheck t", Modern).Check("t").Col("k")[0]);
        Assert.Equal(Value.Of("float64"), Harbor.Ok("let t = tickets add k = type_of(age)\ncheck t", Legacy).Check("t").Col("k")[0]);
        Assert.Equal(Value.Of("int64"), Harbor.Ok("let t = tickets add k = type_of(age)\ncheck t", Modern).Check("t").Col("k")[0]);
    }

    // Spec §2.2: and/or/not: Kleene under null; missing counts as false under nan.
    [Fact]
    public void Logic_with_missing()
    {
        const string script = "let t = tickets add a = age > 30 or true, b = age > 30 and false, c = not (age > 30), d = age > 30 or false\ncheck t";
        var legacy = Harbor.Ok(script, Legacy).Check("t");
        Assert.Equal([Value.Of(true), Value.Of(false), Value.Of(true), Value.Of(false)], new[] { legacy.Col("a")[2], legacy.Col("b")[2], legacy.Col("c")[2], legacy.Col("d")[2] });
        var modern = Harbor.Ok(script, Modern).Check("t");
        Assert.Equal([Value.Of(true), Value.Of(false), Value.Null, Value.Null], new[] { modern.Col("a")[2], modern.Col("b")[2], modern.Col("c")[2], modern.Col("d")[2] });
    }

    // Spec §2.2: typed writes: number into a string column is object under boxed and E-TYPE-WRITE under arrow (and the reverse).
    [Fact]
    public void Typed_writes()
    {
        var legacy = Harbor.Ok("set tickets.note = 5 where ticket_id = 1\nset tickets.age = 'unknown' where ticket_id = 3\ncheck tickets", Legacy).Check("tickets");
        Assert.Equal("object", legacy.Type("note"));
        Assert.Equal(Value.Of(5L), legacy.Col("note")[0]);
        Assert.Equal("object", legacy.Type("age"));
        Assert.Equal(Value.Of("unknown"), legacy.Col("age")[2]);
        var e = Harbor.Fails("set tickets.note = 5 where ticket_id = 1", Modern, ErrorCodes.TypeWrite);
        Assert.Equal(3, e.Span.LineNumber);
        Harbor.Fails("set tickets.age = 'unknown' where ticket_id = 3", Harbor.ArrowNanCow, ErrorCodes.TypeWrite);
        Assert.Equal("object", Harbor.Ok("set tickets.note = true where ticket_id = 1\ncheck tickets", Harbor.BoxedNullAlias).Check("tickets").Type("note"));
    }

    // Spec §2.2: a missing value written: nan turns int64 into float64 and bool into object; boxed strings hold None for the null
    // literal and NaN otherwise; arrow+nan makes every missing string NaN; under null a null in an unchanged type.
    [Fact]
    public void Missing_writes()
    {
        const string script = "set tickets.ticket_id = null where ticket_id = 2\nset tickets.is_child = null where ticket_id = 2\n"
            + "set tickets.note = null where ticket_id = 1\nset tickets.passenger = length(note) * 0 + null where ticket_id = 5\ncheck tickets";
        var legacy = Harbor.Ok(script, Legacy).Check("tickets");
        Assert.Equal("float64", legacy.Type("ticket_id"));
        Assert.Equal(MissingKind.NaN, legacy.Col("ticket_id")[1].Missing);
        Assert.Equal("object", legacy.Type("is_child"));
        Assert.Equal(MissingKind.NoneRef, legacy.Col("note")[0].Missing);
        Assert.Equal(MissingKind.NaN, legacy.Col("passenger")[4].Missing);
        var arrowNan = Harbor.Ok(script, Harbor.ArrowNanCow).Check("tickets");
        Assert.Equal(MissingKind.NaN, arrowNan.Col("note")[0].Missing);
        Assert.Equal("utf8", arrowNan.Type("note"));
        var modern = Harbor.Ok(script, Modern).Check("tickets");
        Assert.Equal("int64", modern.Type("ticket_id"));
        Assert.Equal("bool", modern.Type("is_child"));
        Assert.Equal("utf8", modern.Type("passenger"));
        Assert.Equal(Value.Null, modern.Col("ticket_id")[1]);
        Assert.Equal(Value.Null, modern.Col("note")[0]);
    }

    // Spec §2.2: cast to int64 with missing values: E-CAST under nan, nulls kept under null.
    [Fact]
    public void Cast_with_missing()
    {
        Harbor.Fails("let t = tickets cast age to int64", Legacy, ErrorCodes.Cast);
        Assert.Equal("int64", Harbor.Ok("let t = tickets cast age to float64 cast age to int64\ncheck t", Modern).Check("t").Type("age"));
    }

    // Spec §2.3: division, floored modulo, overflow and rounding as scripts; the NaN of 0/0 is a value under null, missing under nan.
    [Fact]
    public void Arithmetic_rules()
    {
        const string script = "let t = tickets add d = fare / 0, z = (ticket_id - ticket_id) / 0, m = (0 - 7) % 3, r = round(2.5, 0)\nlet n = t where z is null\ncheck t\ncheck n";
        var legacy = Harbor.Ok(script, Legacy);
        Assert.Equal(Value.Of(double.PositiveInfinity), legacy.Check("t").Col("d")[0]);
        Assert.Equal(Value.Of(double.NegativeInfinity), legacy.Check("t").Col("d")[3]);
        Assert.Equal(Value.Of(2L), legacy.Check("t").Col("m")[0]);
        Assert.Equal(Value.Of(2.0), legacy.Check("t").Col("r")[0]);
        Assert.Equal(5, legacy.Check("n").RowCount);
        Assert.Equal(0, Harbor.Ok(script, Modern).Check("n").RowCount);
        Harbor.Fails("let t = tickets add o = ticket_id * 9223372036854775807", Modern, ErrorCodes.Overflow);
    }

    // Spec §2.3 and §3.5: checkpoint labels, duplicates, unknown columns with a suggestion and a position.
    [Fact]
    public void Checkpoints_and_errors()
    {
        var run = Harbor.Ok("check tickets\ncheck tickets as 'after refunds'", Modern);
        Assert.Equal(["tickets", "after refunds"], run.Checkpoints.Select(c => c.Label));
        Assert.Equal(3, run.Checkpoints[0].Line);
        // The parser already refuses this statically; the interpreter checks again at run time.
        var frames = new Dictionary<string, Parity.Engine.Frames.Table> { ["tickets"] = Harbor.Tickets(Modern), ["sailings"] = Harbor.Sailings(Modern) };
        var dup = Harbor.Run("check tickets\ncheck sailings as 'tickets'", Modern, frames);
        Assert.Equal(ErrorCodes.DupCheckpoint, dup.Failure!.Code);
        Assert.Equal(2, dup.Failure.Span.LineNumber);
        Assert.Single(dup.Checkpoints);
        var e = Harbor.Fails("let adults = tickets where fair > 20", Legacy, ErrorCodes.UnknownColumn);
        Assert.Equal("test.parity:3:28: error E-UNKNOWN-COLUMN: frame 'tickets' has no column 'fair' (did you mean 'fare'?)", e.Format());
    }

    // Spec §2.2: grouping drops rows with a missing key and says how many.
    [Fact]
    public void Group_notes_missing_keys()
    {
        foreach (var mode in new[] { Legacy, Modern })
        {
            var run = Harbor.Ok("let g = tickets group by note compute n = count(), total = sum(fare), avg_age = avg(age)\ncheck g", mode);
            Assert.Equal(3, run.Check("g").RowCount);
            var note = Assert.Single(run.Notes);
            Assert.Equal(RunNote.MissingGroupKey, note.Kind);
            Assert.Equal(2, note.Count);
        }
    }

    // Spec §2.3: avg is float64, count int64; expressions may stand around aggregates in compute (our decision, docs/language.md).
    [Fact]
    public void Compute_allows_expressions_around_aggregates()
    {
        foreach (var mode in new[] { Legacy, Modern })
        {
            var g = Harbor.Ok("let g = tickets group by sailing_id compute mean = round(avg(fare), 1), per_head = sum(fare) / count(), tag = text(sailing_id) || ':' || text(count())\ncheck g", mode).Check("g");
            Assert.Equal(3, g.RowCount);
            Assert.Equal("float64", g.Type("mean"));
            Assert.Equal(Value.Of(18.2), g.Col("mean")[0]); // (24.5 + 12.0) / 2 = 18.25, half to even at one digit (IEEE 754 nearest: 18.2)
            Assert.Equal(Value.Of(2.75), g.Col("per_head")[1]); // (30.0 - 24.5) / 2
            Assert.Equal(Value.Of("12:1"), g.Col("tag")[2]);
        }
        // A non-key column outside an aggregate has no single value per group.
        Harbor.Fails("let g = tickets group by sailing_id compute x = fare + count()", Modern, ErrorCodes.AggregatePlace);
    }

    [Fact]
    public void Load_paths_stay_under_the_root()
    {
        var parsed = Parity.Script.Parsing.ScriptParser.Parse("load x from '../outside.csv'", "test.parity");
        var run = Interpreter.Run(parsed.Script, Modern, Harbor.Dir, new RunOptions { Root = Harbor.Dir });
        Assert.Equal(ErrorCodes.PathOutsideRoot, run.Failure!.Code);
        Assert.Contains(Harbor.Dir, run.Failure.Message, StringComparison.Ordinal);
    }
}
