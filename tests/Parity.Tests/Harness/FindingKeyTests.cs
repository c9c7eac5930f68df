using System.Text.Json;
using Parity.Cli;
using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Harness.Gate;
using Parity.Script.Parsing;
using Parity.Script.Syntax;

namespace Parity.Tests.Harness;

/// <summary>
/// Finding identity and root causes (docs/workflow.md, "Finding keys", "One cause, one finding"): keys without
/// line numbers, the canonical mode pair, recurrences folded into <c>also_at</c>, and <c>caused_by</c>.
/// </summary>
public sealed class FindingKeyTests : IDisposable
{
    private const string Tickets = """
        id,passenger,age,fare,note
        1,Åsa Lindqvist,34,12.5,window
        2,Νίκος Παππάς,,8.0,
        3,李小龍,71,-8.0,refund
        4,Zoë 🚢,17,4.25,
        5,Bo,,20.0,late
        """;

    private const string Refunds = """
        load tickets from 'tickets.csv'
        let adults = tickets where age >= 18
        set (tickets take 3).fare = 0 where fare < 0
        let labels = tickets add age_text = text(age)
        check adults
        check labels as 'with labels'
        """;

    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-keys-" + Guid.NewGuid().ToString("N"));

    public FindingKeyTests()
    {
        Directory.CreateDirectory(Path.Combine(_dir, "ferry"));
        File.WriteAllText(Path.Combine(_dir, "ferry", "tickets.csv"), Tickets);
        File.WriteAllText(Path.Combine(_dir, "ferry", "refunds.parity"), Refunds);
    }

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    private (int Exit, string Out, string Err) Cli(params string[] args)
    {
        var o = new StringWriter { NewLine = "\n" };
        var e = new StringWriter { NewLine = "\n" };
        var exit = CliApp.Run(args, new CliContext(o, e, _dir));
        return (exit, o.ToString(), e.ToString());
    }

    private IReadOnlyList<Finding> Findings(string script, string text)
    {
        var path = Path.Combine(_dir, "ferry", script);
        File.WriteAllText(path, text);
        var outcome = new GateSession(new GateOptions { WorkingDirectory = _dir }).RunScript(path);
        Assert.Empty(outcome.ParseErrors);
        return ModeDiffer.CompareAll(outcome.Runs, outcome.Script, DiffOptions.Default);
    }

    [Fact]
    public void Comment_blank_line_spacing_and_unrelated_statement_edits_keep_check_green()
    {
        Assert.Equal(0, Cli("accept", "ferry").Exit);
        var edited = "# Refunds, reviewed\n\n" + Refunds
            .Replace("let adults = tickets where age >= 18", "let   adults =  tickets WHERE age>=18   # adults only", StringComparison.Ordinal)
            .Replace("set (tickets take 3).fare", "\nlet spare = tickets take 1\nset ( tickets take 3 ) . fare", StringComparison.Ordinal);
        File.WriteAllText(Path.Combine(_dir, "ferry", "refunds.parity"), edited);
        var check = Cli("check", "ferry", "--show-accepted");
        Assert.Equal("", check.Err);
        Assert.Equal(0, check.Exit);
        Assert.DoesNotContain("  new  ", check.Out, StringComparison.Ordinal);
        Assert.DoesNotContain("resolved", check.Out, StringComparison.Ordinal);
        // Lines stay in the report for people: the write now stands on line 7.
        Assert.Contains("alias   line 7", check.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Editing_the_statement_that_caused_a_finding_makes_it_new()
    {
        Assert.Equal(0, Cli("accept", "ferry").Exit);
        File.WriteAllText(Path.Combine(_dir, "ferry", "refunds.parity"),
            Refunds.Replace("set (tickets take 3).fare = 0 where fare < 0", "set (tickets take 3).fare = 1 where fare < 0", StringComparison.Ordinal));
        var run = Cli("run", "ferry");
        Assert.Equal(1, run.Exit);
        Assert.Contains("alias   line 3  x1  new", run.Out, StringComparison.Ordinal);
        Assert.Contains("alias   line 3  x0 (accepted x1)  resolved", run.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Swapped_modes_give_identical_reports()
    {
        var a = Cli("run", "ferry", "--modes", "legacy,modern", "--out", "a");
        var b = Cli("run", "ferry", "--modes", "modern,legacy", "--out", "b");
        Assert.Equal(a.Exit, b.Exit);
        Assert.Equal(a.Out, b.Out);
        foreach (var file in new[] { "report.md", "report.json", "junit.xml", "report.html" })
            Assert.Equal(File.ReadAllText(Path.Combine(_dir, "a", file)), File.ReadAllText(Path.Combine(_dir, "b", file)));
        Assert.Contains("in legacy", a.Out, StringComparison.Ordinal);
        // Accepted under one order, every finding stays accepted under the other.
        Assert.Equal(0, Cli("accept", "ferry", "--modes", "modern,legacy").Exit);
        Assert.Equal(0, Cli("check", "ferry").Exit);
    }

    [Fact]
    public void A_type_difference_at_five_checkpoints_is_one_finding_with_four_also_at()
    {
        var findings = Findings("five.parity", """
            load tickets from 'tickets.csv'
            check tickets as 'one'
            let b = tickets select id, passenger
            check b as 'two'
            let c = tickets order by id desc
            check c as 'three'
            let d = tickets where id > 1
            check d as 'four'
            let e = tickets take 2
            check e as 'five'
            """);
        var type = Assert.Single(findings, f => f.Kind == FindingKind.Type && f.Column == "passenger");
        Assert.Equal("one", type.Checkpoint);
        Assert.Equal(["two", "three", "four", "five"], type.AlsoAt);
        Assert.Equal(5, type.Count);
        Assert.Equal(["one", "two", "three", "four", "five"], type.Occurrences.Select(o => o.Checkpoint));
        Assert.Equal("type object in legacy, utf8 in modern", type.Difference);
        Assert.DoesNotContain("line", type.Key, StringComparison.Ordinal);
    }

    [Fact]
    public void A_view_write_followed_by_three_checkpoints_gives_value_findings_with_caused_by()
    {
        var findings = Findings("view.parity", """
            load tickets from 'tickets.csv'
            let first = tickets take 2
            set first.fare = 1.5
            check tickets as 'after'
            let fares = tickets select id, fare
            check fares
            let sorted = tickets order by id desc
            check sorted
            """);
        var alias = Assert.Single(findings, f => f.Kind == FindingKind.Alias);
        Assert.Equal("'set first.fare = 1.5' #1", alias.Statement);
        var values = findings.Where(f => f.Kind == FindingKind.Value && f.Column == "fare").ToList();
        Assert.NotEmpty(values);
        Assert.All(values, v =>
        {
            Assert.Equal(alias.Key, v.CausedBy);
            Assert.Equal(3, v.CausedByLine);
            Assert.EndsWith("after the write at line 3", v.Message, StringComparison.Ordinal);
        });
        var fare = Assert.Single(values, v => v.Column == "fare");
        Assert.Equal(["fares", "sorted"], fare.AlsoAt);
        Assert.Equal(6, fare.Count);
        // Differences of missing markers alone are never tied to a write.
        Assert.All(findings.Where(f => f.Kind == FindingKind.Missing && f.Difference.Contains("where modern has null", StringComparison.Ordinal) && !f.Difference.Contains("value", StringComparison.Ordinal)),
            f => Assert.Null(f.CausedBy));
    }

    [Fact]
    public void Json_findings_carry_statement_difference_also_at_and_caused_by()
    {
        File.WriteAllText(Path.Combine(_dir, "ferry", "view.parity"), "load tickets from 'tickets.csv'\nlet first = tickets take 2\nset first.fare = 1.5\ncheck tickets as 'after'\ncheck tickets as 'again'\n");
        Cli("run", "ferry/view.parity", "--out", "out", "--format", "json");
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(_dir, "out", "report.json")));
        Assert.Equal(2, doc.RootElement.GetProperty("version").GetInt32());
        var findings = doc.RootElement.GetProperty("scripts")[0].GetProperty("findings").EnumerateArray().ToList();
        var alias = findings.Single(f => f.GetProperty("kind").GetString() == "alias");
        Assert.Equal("'set first.fare = 1.5' #1", alias.GetProperty("statement").GetString());
        var value = findings.Single(f => f.GetProperty("kind").GetString() == "value");
        Assert.Equal(alias.GetProperty("key").GetString(), value.GetProperty("caused_by").GetString());
        Assert.Equal(["again"], value.GetProperty("also_at").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal(2, value.GetProperty("occurrences").GetArrayLength());
        Assert.Equal(value.GetProperty("count").GetInt32(), value.GetProperty("occurrences").EnumerateArray().Sum(o => o.GetProperty("count").GetInt32()));
    }

    [Fact]
    public void A_bool_condition_with_missing_cells_gets_the_bool_hint_not_the_string_predicate_hint()
    {
        File.WriteAllText(Path.Combine(_dir, "ferry", "flags.csv"), "id,flag,note\n1,true,a\n2,,b\n3,false,\n");
        var boolFinding = Assert.Single(Findings("flags.parity", "load t from 'flags.csv'\nlet kept = t where flag\ncheck kept\n"), f => f.Kind == FindingKind.Error);
        Assert.Equal(MigrationHints.MaskBoolError, boolFinding.Hint);
        var stringFinding = Assert.Single(Findings("notes.parity", "load t from 'flags.csv'\nlet kept = t where contains(note, 'a')\ncheck kept\n"), f => f.Kind == FindingKind.Error);
        Assert.Equal(MigrationHints.MaskError, stringFinding.Hint);
        // Rows are numbered from 0 in errors: row 1 of flags.csv's data is the first missing flag.
        Assert.Contains("at row 1;", boolFinding.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("set t.fare = 0", "set t . fare=0 # zero")]
    [InlineData("let a = t where x >= 18", "LET a=t WHERE x>=18")]
    [InlineData("let a = t where contains(n, 'it''s')", "let a = t where contains ( n , 'it''s' )")]
    [InlineData("let a = t add b = x + 1, c = upper(n)", "let a = t add \\\n    b = x + 1, \\\n    c = upper(n)")]
    public void Canonical_text_ignores_comments_spacing_continuations_and_keyword_case(string canonical, string written)
    {
        var parsed = ScriptParser.Parse("load t from 'x.csv'\n" + written + "\n", "s.parity");
        Assert.Equal(canonical, parsed.Script.Statements[1].Canonical);
    }

    [Fact]
    public void Identical_statements_are_told_apart_by_occurrence()
    {
        var parsed = ScriptParser.Parse("load t from 'x.csv'\nset t.a = 1\n\nset t.a = 1\nset t.a = 2 \\\n  where a = 1\n", "s.parity");
        var keys = new StatementKeys(parsed.Script.Statements);
        Assert.Equal("'set t.a = 1' #1", keys.KeyAt(2));
        Assert.Equal("'set t.a = 1' #2", keys.KeyAt(4));
        Assert.Equal("'set t.a = 2 where a = 1' #1", keys.KeyAt(6));
        Assert.True(StatementKeys.TryParse(keys.KeyAt(4), out var text, out var n));
        Assert.Equal(("set t.a = 1", 2), (text, n));
    }

    [Fact]
    public void Check_names_key_columns_and_an_unknown_key_is_a_located_error()
    {
        var parsed = ScriptParser.Parse("load t from 'x.csv'\ncheck t key id, \"leg no\" as 'by id'\n", "s.parity");
        Assert.False(parsed.HasErrors);
        var check = Assert.IsType<CheckStatement>(parsed.Script.Statements[1]);
        Assert.Equal(["id", "leg no"], check.Keys.Select(k => k.Name));
        Assert.Equal("by id", check.EffectiveLabel);
        File.WriteAllText(Path.Combine(_dir, "ferry", "badkey.parity"), "load tickets from 'tickets.csv'\ncheck tickets key idd\n");
        var (exit, _, err) = Cli("run", "ferry/badkey.parity");
        Assert.Equal(2, exit);
        Assert.Contains("ferry/badkey.parity:2:19: error E-UNKNOWN-COLUMN: frame 'tickets' has no column 'idd' to use as a key (did you mean 'id'?)", err, StringComparison.Ordinal);
    }

    // Order of modes: nearer legacy first (fewer axes flipped; then boxed, nan, alias first). Common practice, no source.
    [Fact]
    public void Canonical_mode_order_puts_the_mode_nearer_legacy_first()
    {
        var order = ModeOrder.Canonical([Mode.Modern, Mode.Parse("arrow+nan+alias"), Mode.Legacy, Mode.Parse("boxed+null+cow")]);
        Assert.Equal(["legacy", "arrow+nan+alias", "boxed+null+cow", "modern"], order.Select(m => m.Name));
    }

    // IEEE 754 doubles: 4.5000001 - 4.5 is about 1e-7.
    [Theory]
    [InlineData(0.0, 0.0, 4.5, 4.5000001, false)]
    [InlineData(0.001, 0.0, 4.5, 4.5000001, true)]
    [InlineData(0.0, 1e-6, 4.5, 4.5000001, true)]
    [InlineData(0.0, 1e-9, 4.5, 4.5000001, false)]
    [InlineData(0.0, 0.01, 1000.0, 1009.0, true)]
    [InlineData(1.0, 0.0, double.PositiveInfinity, 1e308, false)]
    [InlineData(1.0, 1.0, double.NaN, 0.0, false)]
    [InlineData(0.0, 0.0, double.NaN, double.NaN, true)]
    public void Float_tolerance_is_absolute_or_relative(double absolute, double relative, double a, double b, bool equal)
    {
        Assert.Equal(equal, new FloatTolerance(absolute, relative).Equal(a, b));
        Assert.Equal(equal, new FloatTolerance(absolute, relative).Equal(b, a));
    }
}
