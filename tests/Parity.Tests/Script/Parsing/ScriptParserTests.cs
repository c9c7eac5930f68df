using Parity.Engine.Values;
using Parity.Script.Parsing;
using Parity.Script.Syntax;

namespace Parity.Tests.Script.Parsing;

/// <summary>Direct checks of the tree the parser builds, beyond the printed golden files.</summary>
public sealed class ScriptParserTests
{
    private static ScriptNode ParseOk(string text)
    {
        var result = ScriptParser.Parse(text, "t.parity");
        Assert.False(result.HasErrors, string.Join("\n", result.Diagnostics));
        return result.Script;
    }

    [Fact]
    public void Set_where_belongs_to_the_write_and_parenthesised_where_to_the_derivation()
    {
        // Spec §3.3: set F.c = EXPR [where COND]; set (DERIVATION).c = EXPR [where COND].
        var script = ParseOk("load tickets from 't.csv'\nset tickets.fare = 0 where fare < 0\nset (tickets where fare < 0).fare = 0");
        var plain = Assert.IsType<SetStatement>(script.Statements[1]);
        Assert.False(plain.IsChained);
        Assert.NotNull(plain.Condition);
        var chained = Assert.IsType<SetStatement>(script.Statements[2]);
        Assert.True(chained.IsChained);
        Assert.Null(chained.Condition);
        Assert.IsType<WhereClause>(Assert.Single(chained.Chain!.Clauses));
    }

    [Fact]
    public void Literals_have_their_engine_values()
    {
        var script = ParseOk("load t from 't.csv'\nlet x = t add a = 42, b = 3.5, c = 'it''s', d = TRUE, e = null, f = -9223372036854775808");
        var items = ((AddClause)((LetStatement)script.Statements[1]).Value.Clauses[0]).Items;
        Assert.Equal(Value.Of(42L), ((LiteralExpr)items[0].Value).Value);
        Assert.Equal(Value.Of(3.5), ((LiteralExpr)items[1].Value).Value);
        Assert.Equal(Value.Of("it's"), ((LiteralExpr)items[2].Value).Value);
        Assert.Equal(Value.Of(true), ((LiteralExpr)items[3].Value).Value);
        Assert.True(((LiteralExpr)items[4].Value).IsNull);
        Assert.Equal(MissingKind.Null, ((LiteralExpr)items[4].Value).Value.Missing);
        Assert.Equal(Value.Of(long.MinValue), ((LiteralExpr)items[5].Value).Value);
    }

    [Fact]
    public void Load_keeps_path_format_and_options()
    {
        var script = ParseOk("load t2 from 'ferry/raw.csv' as csv with (missing = ['', 'n/a'], delimiter = ';')");
        var load = Assert.IsType<LoadStatement>(Assert.Single(script.Statements));
        Assert.Equal("ferry/raw.csv", load.Path);
        Assert.Equal("csv", load.Format!.Name);
        Assert.Equal(2, load.Options.Count);
        Assert.True(load.Options[0].IsList);
        Assert.Equal(["", "n/a"], load.Options[0].Values.Select(v => v.Value.String));
        Assert.False(load.Options[1].IsList);
        Assert.Equal(13, load.PathSpan.Column);
    }

    [Fact]
    public void Every_error_in_the_script_is_reported_and_good_statements_are_kept()
    {
        // Spec §3.5 and style rule 7: recover at the next statement.
        var result = ScriptParser.Parse("load t from 't.csv'\nlet a = t where\nlet b = t\nlet c = t take x\ncheck b", "t.parity");
        Assert.Equal(["t.parity:2:16: error E-SYNTAX: expected an expression, found end of line",
                      "t.parity:4:16: error E-SYNTAX: expected a whole number of rows (0 or more), found name 'x'"],
            result.Diagnostics.Select(d => d.Format()));
        Assert.Equal(3, result.Script.Statements.Count);
    }

    [Fact]
    public void Binary_and_unary_spans_point_at_the_operator()
    {
        var script = ParseOk("load t from 't.csv'\nlet x = t where a + b > -c");
        var where = (WhereClause)((LetStatement)script.Statements[1]).Value.Clauses[0];
        var gt = Assert.IsType<BinaryExpr>(where.Condition);
        Assert.Equal(BinaryOp.Gt, gt.Op);
        Assert.Equal(22, gt.Span.Column);
        Assert.Equal(18, ((BinaryExpr)gt.Left).Span.Column);
        Assert.Equal(UnaryOp.Negate, ((UnaryExpr)gt.Right).Op);
    }
}
