using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Script.Running;

/// <summary>Spec §2.2 "Writes and aliasing" and §3.3 in legacy (alias) and modern (cow).</summary>
public sealed class WriteTests
{
    private static readonly Mode Legacy = Mode.Legacy;
    private static readonly Mode Modern = Mode.Modern;

    // Spec §2.2: under alias take/skip/column are views both ways; under cow every derived frame is independent.
    [Theory]
    [InlineData("take 2", 0)]
    [InlineData("skip 3", 3)]
    [InlineData("column fare", 0)]
    public void Views_share_both_ways_under_alias_only(string clause, int firstRow)
    {
        var script = $"let v = tickets {clause}\nset v.fare = 0\ncheck tickets as 'parent'\nset tickets.fare = 99\ncheck v";
        var legacy = Harbor.Ok(script, Legacy);
        Assert.Equal(Value.Of(0.0), legacy.Check("parent").Col("fare")[firstRow]);
        Assert.Equal(Value.Of(99.0), legacy.Check("v").Col("fare")[0]);
        Assert.Equal(["tickets", "v"], legacy.Writes[0].ChangedFrames);
        Assert.Equal(["tickets", "v"], legacy.Writes[1].ChangedFrames);
        Assert.Empty(legacy.Warnings);

        var modern = Harbor.Ok(script, Modern);
        Assert.NotEqual(Value.Of(0.0), modern.Check("parent").Col("fare")[firstRow]);
        Assert.NotEqual(Value.Of(99.0), modern.Check("v").Col("fare")[0]);
        Assert.Equal(["v"], modern.Writes[0].ChangedFrames);
        Assert.Equal(["tickets"], modern.Writes[1].ChangedFrames);
    }

    // Spec §2.2: a write into a frame made by a copying operation warns W-MAYBE-COPY under alias, listing the frames reached.
    [Theory]
    [InlineData("where fare > 0")]
    [InlineData("select ticket_id, fare")]
    [InlineData("join sailings on sailing_id")]
    [InlineData("order by fare")]
    public void Copies_warn_under_alias(string clause)
    {
        var script = $"let w = tickets {clause}\nset w.fare = 0\ncheck tickets";
        var legacy = Harbor.Ok(script, Legacy);
        var warning = Assert.Single(legacy.Warnings);
        Assert.Equal(ErrorCodes.MaybeCopy, warning.Code);
        Assert.Equal(["w"], warning.ReachedFrames);
        Assert.Equal(4, warning.Line);
        Assert.Equal(Value.Of(24.5), legacy.Check("tickets").Col("fare")[0]);
        Assert.Empty(Harbor.Ok(script, Modern).Warnings);
    }

    // Spec §2.2/§3.3: a chained write updates the parent under alias when the temporary is a view, does nothing when it is a
    // copy (W-MAYBE-COPY with no frame reached), and never has an effect under cow (W-CHAINED-WRITE).
    [Theory]
    [InlineData("take 2", true)]
    [InlineData("skip 1", true)]
    [InlineData("column fare", true)]
    [InlineData("take 4 skip 1", true)]
    [InlineData("where fare < 0", false)]
    [InlineData("select fare", false)]
    [InlineData("rename age to years", false)]
    [InlineData("cast fare to float64", false)]
    [InlineData("add x = 1", false)]
    [InlineData("fill note with '-'", false)]
    [InlineData("drop missing age", false)]
    [InlineData("order by fare", false)]
    [InlineData("distinct", false)]
    [InlineData("join sailings on sailing_id", false)]
    [InlineData("append tickets", false)]
    [InlineData("group by sailing_id compute fare = sum(fare)", false)]
    public void Chained_writes(string clause, bool isView)
    {
        var script = $"set (tickets {clause}).fare = 1000\ncheck tickets";
        var legacy = Harbor.Ok(script, Legacy);
        var reached = legacy.Check("tickets").Col("fare").Contains(Value.Of(1000.0));
        Assert.Equal(isView, reached);
        Assert.Equal(isView ? ["tickets"] : [], legacy.Writes[0].ChangedFrames);
        if (isView) Assert.Empty(legacy.Warnings);
        else
        {
            var w = Assert.Single(legacy.Warnings);
            Assert.Equal(ErrorCodes.MaybeCopy, w.Code);
            Assert.Empty(w.ReachedFrames);
        }

        var modern = Harbor.Ok(script, Modern);
        Assert.DoesNotContain(Value.Of(1000.0), modern.Check("tickets").Col("fare"));
        var cw = Assert.Single(modern.Warnings);
        Assert.Equal(ErrorCodes.ChainedWrite, cw.Code);
        Assert.Empty(cw.ReachedFrames);
        Assert.Empty(modern.Writes[0].ChangedFrames);
        Assert.StartsWith("(tickets ", modern.Writes[0].Target, StringComparison.Ordinal);
    }

    // Spec §2.2: adding a column to a view under alias gives the view its own column; the parent does not get it.
    [Fact]
    public void New_column_on_a_view()
    {
        var run = Harbor.Ok("let v = tickets take 2\nset v.extra = 1\ncheck v\ncheck tickets", Legacy);
        Assert.Equal(-1, run.Check("tickets").IndexOf("extra"));
        Assert.Equal(Value.Of(1L), run.Check("v").Col("extra")[1]);
        Assert.Equal(["v"], run.Writes[0].ChangedFrames);
    }

    // Spec §2.3: set ... where on a new column gives missing values where the condition is not true.
    [Fact]
    public void New_column_with_where()
    {
        foreach (var mode in new[] { Legacy, Modern })
        {
            var t = Harbor.Ok("set tickets.refund = true where fare < 0\ncheck tickets", mode).Check("tickets");
            Assert.Equal(Value.Of(true), t.Col("refund")[3]);
            Assert.True(t.Col("refund")[0].IsMissing);
            Assert.Equal(mode.IsNull ? "bool" : "object", t.Type("refund"));
        }
    }

    // Spec §2.2: under cow row-preserving derivations share columns (O(columns)) and the first write copies only the written column;
    // under alias they copy eagerly.
    [Fact]
    public void Cow_shares_columns_until_the_first_write()
    {
        const string script = "let r = tickets rename fare to price cast age to int64 add price2 = price select price, price2, age take 5\n"
            + "check r as 'before'\nset r.price = 0\ncheck r\ncheck tickets";
        var modern = Harbor.Ok(script, Modern);
        var tickets = modern.Check("tickets");
        Assert.Same(tickets["fare"], modern.Check("before")["price"]);
        Assert.Same(tickets["fare"], modern.Check("before")["price2"]);
        Assert.Same(tickets["age"], modern.Check("r")["age"]);
        Assert.NotSame(tickets["fare"], modern.Check("r")["price"]);
        Assert.Same(tickets["fare"], modern.Check("r")["price2"]);

        var legacy = Harbor.Ok(script.Replace("cast age to int64 ", "", StringComparison.Ordinal), Legacy);
        Assert.NotSame(legacy.Check("tickets")["fare"], legacy.Check("before")["price"]);
    }

    // Spec §2.2: the aliasing set of a write lists every named frame whose contents changed, sorted; a write of equal values changes nothing.
    [Fact]
    public void Aliasing_sets()
    {
        const string script = "let a = tickets take 3\nlet b = a skip 1\nlet c = tickets skip 4\nset b.age = 1\nset tickets.age = age";
        var legacy = Harbor.Ok(script, Legacy);
        Assert.Equal(["a", "b", "tickets"], legacy.Writes[0].ChangedFrames);
        Assert.Empty(legacy.Writes[1].ChangedFrames);
        Assert.Equal(["b"], Harbor.Ok(script, Modern).Writes[0].ChangedFrames);
        Assert.Equal("b.age", legacy.Writes[0].Target);
    }

    // Spec §2.2: a write through a view that changes the type reaches the parent in its new type (alias), or is an error (arrow).
    [Fact]
    public void View_writes_follow_the_typed_write_rule()
    {
        var legacy = Harbor.Ok("let v = tickets take 1\nset v.note = 7\ncheck tickets", Legacy).Check("tickets");
        Assert.Equal("object", legacy.Type("note"));
        Assert.Equal(Value.Of(7L), legacy.Col("note")[0]);
        Harbor.Fails("let v = tickets take 1\nset v.note = 7", Harbor.ArrowNanAlias, ErrorCodes.TypeWrite);
    }
}
