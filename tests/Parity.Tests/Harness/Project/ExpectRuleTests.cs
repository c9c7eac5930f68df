using Parity.Harness.Findings;
using Parity.Harness.Project;

namespace Parity.Tests.Harness.Project;

/// <summary>Expect rules: each matcher, the every-difference rule for from/to, and counting what matched nothing.</summary>
public sealed class ExpectRuleTests
{
    private static Finding F(FindingKind kind, string? checkpoint, string? column, params (string From, string To)[] differences) => new()
    {
        Kind = kind,
        Script = "fixtures/scripts/refunds.parity",
        Line = 4,
        Checkpoint = checkpoint,
        Column = column,
        Count = 1,
        Message = "m",
        Hint = "h",
        Modes = ["legacy", "modern"],
        FromTo = Array.ConvertAll(differences, d => new FindingDifference(d.From, d.To)),
    };

    private static ExpectRule Rule() => new() { Location = "parity.json:1:1" };

    [Fact]
    public void Each_matcher_narrows_the_rule()
    {
        var typeNote = F(FindingKind.Type, "refunds", "note", ("object", "utf8"));
        Assert.True((Rule() with { Kind = FindingKind.Type }).Matches(typeNote));
        Assert.False((Rule() with { Kind = FindingKind.Missing }).Matches(typeNote));
        Assert.True((Rule() with { Script = "fixtures/**/*.parity" }).Matches(typeNote));
        Assert.True((Rule() with { Script = "**/refunds.parity" }).Matches(typeNote));
        Assert.False((Rule() with { Script = "fixtures/*.parity" }).Matches(typeNote)); // * stops at /
        Assert.True((Rule() with { Checkpoint = "ref*" }).Matches(typeNote));
        Assert.False((Rule() with { Checkpoint = "after*" }).Matches(typeNote));
        Assert.True((Rule() with { Columns = ["fare", "no?e"] }).Matches(typeNote));
        Assert.False((Rule() with { Columns = ["fare"] }).Matches(typeNote));
        Assert.True((Rule() with { From = "object", To = "utf8" }).Matches(typeNote));
        Assert.False((Rule() with { From = "object", To = "bool" }).Matches(typeNote));
    }

    [Fact]
    public void A_statement_finding_never_matches_a_checkpoint_or_column_glob()
    {
        var alias = F(FindingKind.Alias, null, null);
        Assert.False((Rule() with { Checkpoint = "*" }).Matches(alias));
        Assert.False((Rule() with { Columns = ["*"] }).Matches(alias));
        Assert.True((Rule() with { Kind = FindingKind.Alias }).Matches(alias));
    }

    [Fact]
    public void From_and_to_must_hold_for_every_difference_of_the_finding()
    {
        // A NaN -> null group that also holds the text 'nan' where modern has null is not wholly expected.
        var mixed = F(FindingKind.Missing, "names", "note", ("NaN", "null"), ("'nan'", "null"));
        var rule = Rule() with { Kind = FindingKind.Missing, From = "NaN", To = "null" };
        Assert.False(rule.Matches(mixed));
        Assert.True(rule.Matches(F(FindingKind.Missing, "names", "note", ("NaN", "null"))));
        Assert.False(rule.Matches(F(FindingKind.Missing, null, null))); // rows dropped: no from/to recorded
    }

    [Fact]
    public void The_set_marks_findings_expected_and_reports_rules_that_matched_nothing()
    {
        var rules = new ExpectRuleSet([
            Rule() with { Kind = FindingKind.Type, From = "object", To = "utf8" },
            Rule() with { Location = "parity.json:9:5", Kind = FindingKind.Warning },
            Rule() with { Columns = ["note"] },
        ]);
        var findings = new[]
        {
            F(FindingKind.Type, "refunds", "note", ("object", "utf8")),
            F(FindingKind.Value, "refunds", "fare"),
            F(FindingKind.Type, "refunds", "passenger", ("object", "utf8")) with { Status = FindingStatus.Resolved },
        };
        var marked = rules.Apply(findings);
        Assert.Equal([FindingStatus.Expected, FindingStatus.New, FindingStatus.Resolved], [.. marked.Select(f => f.Status)]);
        Assert.Equal(1, rules.Hits(0));
        Assert.Equal(1, rules.Hits(2)); // both rules that match the note finding count it
        Assert.Equal(["parity.json:9:5"], [.. rules.Unmatched().Select(r => r.Location)]);
    }
}
