using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Script.Running;
using static Parity.Tests.Harness.HarnessFixtures;

namespace Parity.Tests.Harness;

public sealed class DifferTests
{
    private static readonly Mode L = Mode.Legacy;
    private static readonly Mode M = Mode.Modern;

    private static IReadOnlyList<Finding> Diff(ModeRun a, ModeRun b, double tolerance = 0) =>
        ModeDiffer.Compare(a, b, "ferry/refunds.parity", DiffOptions.Default with { FloatTolerance = tolerance });

    private static Finding Single(IReadOnlyList<Finding> findings, FindingKind kind, string? column)
    {
        var list = findings.Where(f => f.Kind == kind && f.Column == column).ToList();
        Assert.Single(list);
        return list[0];
    }

    [Fact]
    public void Same_mode_same_data_has_no_findings()
    {
        Assert.Empty(Diff(Run(L, ("tickets", Tickets(L))), Run(L, ("tickets", Tickets(L)))));
    }

    [Fact]
    public void Int64_against_float64_is_one_type_finding_and_no_value_findings()
    {
        // Spec §2.1: integers with missing values are float64 under nan and int64 with nulls under null.
        var findings = Diff(Run(L, ("tickets", Tickets(L))), Run(M, ("tickets", Tickets(M))));
        var type = Single(findings, FindingKind.Type, "age");
        Assert.Equal(1, type.Count);
        Assert.Contains("float64", type.Message, StringComparison.Ordinal);
        Assert.Contains("int64", type.Message, StringComparison.Ordinal);
        Assert.Equal(MigrationHints.IntToFloat, type.Hint);
        Assert.DoesNotContain(findings, f => f.Kind == FindingKind.Value);
        // Strings: object under boxed, utf8 under arrow (spec §2.1).
        Assert.Equal(MigrationHints.StringStorage, Single(findings, FindingKind.Type, "passenger").Hint);
    }

    [Fact]
    public void Missing_marker_kind_is_a_missing_finding_with_samples_side_by_side()
    {
        var findings = Diff(Run(L, ("tickets", Tickets(L))), Run(M, ("tickets", Tickets(M))));
        var age = Single(findings, FindingKind.Missing, "age");
        Assert.Equal(2, age.Count);
        Assert.Equal(["legacy", "modern"], age.Modes);
        Assert.Equal(1, age.Samples[0].Row);
        Assert.Equal(["NaN", "null"], age.Samples[0].Values);
        Assert.Equal(MigrationHints.MarkerKind, age.Hint);
    }

    [Fact]
    public void None_against_nan_is_a_missing_finding()
    {
        // Spec §2.2: boxed+nan keeps None (a written null) apart from NaN.
        var a = Table(L, ("note", [S("x"), Value.NoneRef]));
        var b = Table(new Mode(StringStorage.Arrow, MissingMarker.Nan, WriteSemantics.Alias), ("note", [S("x"), Value.NaN]));
        var f = Single(Diff(Run(L, ("t", a)), Run(new Mode(StringStorage.Arrow, MissingMarker.Nan, WriteSemantics.Alias), ("t", b))), FindingKind.Missing, "note");
        Assert.Equal(["None", "NaN"], f.Samples[0].Values);
    }

    [Fact]
    public void Nan_text_against_missing_gets_the_text_hint()
    {
        // Spec §2.2: text(x) under boxed+nan turns a missing value into 'nan'.
        var a = Table(L, ("age_text", [S("34.0"), S("nan")]));
        var b = Table(M, ("age_text", [S("34.0"), Value.Null]));
        var f = Single(Diff(Run(L, ("t", a)), Run(M, ("t", b))), FindingKind.Missing, "age_text");
        Assert.Equal(1, f.Count);
        Assert.Equal(MigrationHints.NanText, f.Hint);
        Assert.Equal(["'nan'", "null"], f.Samples[0].Values);
    }

    [Fact]
    public void Value_against_missing_is_a_missing_finding()
    {
        var a = Table(L, ("fare", [F(1.5), F(2.5)]));
        var b = Table(L, ("fare", [F(1.5), Value.NaN]));
        var f = Single(Diff(Run(L, ("t", a)), Run(L, ("t", b))), FindingKind.Missing, "fare");
        Assert.Equal(MigrationHints.ValueVersusMissing, f.Hint);
        Assert.Equal(["2.5", "NaN"], f.Samples[0].Values);
    }

    [Fact]
    public void Values_compare_exactly_unless_a_tolerance_is_given()
    {
        var a = Table(L, ("fare", [F(0.1 + 0.2), F(10.0)]));
        var b = Table(L, ("fare", [F(0.3), F(10.0)]));
        var f = Single(Diff(Run(L, ("t", a)), Run(L, ("t", b))), FindingKind.Value, "fare");
        Assert.Equal(1, f.Count);
        // IEEE 754: 0.1 + 0.2 is 0.30000000000000004 in binary64.
        Assert.Equal(["0.30000000000000004", "0.3"], f.Samples[0].Values);
        Assert.Empty(Diff(Run(L, ("t", a)), Run(L, ("t", b)), tolerance: 1e-9));
    }

    [Fact]
    public void Int_and_float_compare_by_value_exactly()
    {
        var a = Table(L, ("n", [I(3), I(9_007_199_254_740_993)]));
        var b = Table(L, ("n", [F(3.0), F(9_007_199_254_740_992.0)]));
        var findings = Diff(Run(L, ("t", a)), Run(L, ("t", b)));
        var v = Single(findings, FindingKind.Value, "n");
        Assert.Equal(1, v.Count); // 2^53+1 has no binary64 form (IEEE 754), so it is not equal to 2^53
        Assert.Equal(1, v.Samples[0].Row);
    }

    [Fact]
    public void Samples_are_capped_at_five_and_the_count_is_complete()
    {
        var n = 40;
        var a = Table(L, ("x", Enumerable.Range(0, n).Select(i => I(i)).ToArray()));
        var b = Table(L, ("x", Enumerable.Range(0, n).Select(i => I(i + 1)).ToArray()));
        var f = Single(Diff(Run(L, ("t", a)), Run(L, ("t", b))), FindingKind.Value, "x");
        Assert.Equal(n, f.Count);
        Assert.Equal(5, f.Samples.Count);
        Assert.Equal([0, 1, 2, 3, 4], f.Samples.Select(s => s.Row!.Value));
    }

    [Fact]
    public void Row_count_difference_is_one_shape_finding_starting_at_the_first_disagreeing_row()
    {
        var a = Table(L, ("x", [I(1), I(2), I(3), I(4)]));
        var b = Table(L, ("x", [I(1), I(3), I(4)]));
        var findings = Diff(Run(L, ("t", a)), Run(L, ("t", b)));
        var f = Single(findings, FindingKind.Shape, null);
        Assert.Equal(1, f.Count);
        Assert.Contains("the first 1 rows agree", f.Message, StringComparison.Ordinal);
        Assert.Equal(1, f.Samples[0].Row);
        Assert.Equal(["2", "3"], f.Samples[0].Values);
        Assert.Equal(["(no row)"], f.Samples[^1].Values.Skip(1));
        Assert.DoesNotContain(findings, x => x.Kind == FindingKind.Value);
    }

    [Fact]
    public void Column_set_and_order_differences_are_shape_findings_per_column()
    {
        var cow = new Mode(StringStorage.Boxed, MissingMarker.Nan, WriteSemantics.Cow);
        var a = Table(L, ("a", [I(1)]), ("b", [I(2)]), ("only_a", [I(3)]));
        var b = Table(cow, ("b", [I(2)]), ("a", [I(1)]), ("only_b", [I(4)]));
        var findings = Diff(Run(L, ("t", a)), Run(cow, ("t", b)));
        Assert.Equal("column only in legacy", Single(findings, FindingKind.Shape, "only_a").Message);
        Assert.Equal("column only in boxed+nan+cow", Single(findings, FindingKind.Shape, "only_b").Message);
        Assert.Equal("column at position 1 in legacy and 2 in boxed+nan+cow", Single(findings, FindingKind.Shape, "a").Message);
        Assert.Equal(MigrationHints.ColumnOrder, Single(findings, FindingKind.Shape, "b").Hint);
        Assert.DoesNotContain(findings, f => f.Kind == FindingKind.Value);
    }

    [Fact]
    public void Different_aliasing_sets_are_an_alias_finding_with_the_chained_write_hint()
    {
        // Spec §2.2: a chained write updates the parent under alias when the temporary is a view; never under cow.
        var a = Run(L);
        var b = Run(M);
        a.Writes.Add(new WriteRecord(3, 1, "(tickets take 3).fare", ["tickets"]));
        b.Writes.Add(new WriteRecord(3, 1, "(tickets take 3).fare", []));
        b.Warnings.Add(new RunWarning("W-CHAINED-WRITE", 3, 1, "chained write has no effect", []));
        var findings = Diff(a, b);
        var alias = Single(findings, FindingKind.Alias, null);
        Assert.Equal(3, alias.Line);
        Assert.Null(alias.Checkpoint);
        Assert.Equal(["{'tickets'}", "{}"], alias.Samples[0].Values);
        Assert.Equal(MigrationHints.ChainedWrite, alias.Hint);
        var warning = Single(findings, FindingKind.Warning, null);
        Assert.Contains("W-CHAINED-WRITE in modern only", warning.Message, StringComparison.Ordinal);
        Assert.Equal(["no warning; reached {'tickets'}", "W-CHAINED-WRITE; reached {}"], warning.Samples[0].Values);
    }

    [Fact]
    public void Equal_aliasing_sets_and_shared_warnings_give_nothing()
    {
        var a = Run(L);
        var b = Run(M);
        a.Writes.Add(new WriteRecord(3, 1, "tickets.fare", ["tickets"]));
        b.Writes.Add(new WriteRecord(3, 1, "tickets.fare", ["tickets"]));
        a.Warnings.Add(new RunWarning("W-X", 3, 1, "m", []));
        b.Warnings.Add(new RunWarning("W-X", 3, 1, "m", []));
        Assert.Empty(Diff(a, b));
    }

    [Fact]
    public void An_error_in_one_mode_lists_the_checkpoints_it_never_reached()
    {
        // Spec §3.5: a runtime error in one mode only is a finding of kind error.
        var t = Tickets(M);
        var a = Run(L, ("adults", Tickets(L)));
        a.Failure = Error("E-CAST", "column 'age' has missing values", 12);
        var b = Run(M, ("adults", t), ("after cast", t), ("totals", t));
        var findings = Diff(a, b);
        var e = Single(findings, FindingKind.Error, null);
        Assert.Equal(12, e.Line);
        Assert.Contains("E-CAST in legacy only", e.Message, StringComparison.Ordinal);
        Assert.Contains("never reached: 'after cast', 'totals'", e.Message, StringComparison.Ordinal);
        Assert.Equal(MigrationHints.CastError, e.Hint);
        // The checkpoints the failed mode never reached are not also shape findings.
        Assert.DoesNotContain(findings, f => f.Kind == FindingKind.Shape);
    }

    [Fact]
    public void Rows_dropped_by_a_null_condition_are_a_missing_finding_on_the_statement()
    {
        // Spec §2.2: a row whose filter condition is null is not kept; the report says how many.
        var a = Run(L);
        var b = Run(M);
        b.Notes.Add(new RunNote(RunNote.NullCondition, 2, 30, 2, "2 rows dropped"));
        a.Notes.Add(new RunNote(RunNote.MissingGroupKey, 7, 1, 1, "1 row"));
        b.Notes.Add(new RunNote(RunNote.MissingGroupKey, 7, 1, 1, "1 row"));
        var findings = Diff(a, b);
        var f = Assert.Single(findings);
        Assert.Equal(FindingKind.Missing, f.Kind);
        Assert.Equal(2, f.Line);
        Assert.Equal(2, f.Count);
        Assert.Equal(MigrationHints.NullCondition, f.Hint);
    }

    [Fact]
    public void Missing_group_keys_that_differ_are_a_missing_finding()
    {
        var a = Run(L);
        var b = Run(M);
        a.Notes.Add(new RunNote(RunNote.MissingGroupKey, 7, 1, 1, "1 row"));
        var f = Assert.Single(Diff(a, b));
        Assert.Equal(MigrationHints.MissingGroupKey, f.Hint);
    }

    [Fact]
    public void Order_is_deterministic_by_line_checkpoint_kind_column()
    {
        var runs = new[] { Run(L, ("b", Tickets(L)), ("a", Tickets(L))), Run(M, ("b", Tickets(M)), ("a", Tickets(M))) };
        runs[1].Writes.Add(new WriteRecord(1, 1, "x", ["x"]));
        runs[0].Writes.Add(new WriteRecord(1, 1, "x", []));
        var first = ModeDiffer.CompareAll(runs, "s", DiffOptions.Default).Select(f => f.Key + "#" + f.Count).ToList();
        var second = ModeDiffer.CompareAll(runs, "s", DiffOptions.Default).Select(f => f.Key + "#" + f.Count).ToList();
        Assert.Equal(first, second);
        var all = ModeDiffer.CompareAll(runs, "s", DiffOptions.Default);
        Assert.Equal(FindingKind.Alias, all[0].Kind);
        Assert.True(all.Zip(all.Skip(1)).All(p => FindingOrder.Instance.Compare(p.First, p.Second) <= 0));
    }

    [Fact]
    public void Checkpoint_summaries_list_rows_and_types_per_mode()
    {
        var s = CheckpointSummaries.Build([Run(L, ("tickets", Tickets(L))), Run(M, ("tickets", Tickets(M)))]);
        var c = Assert.Single(s);
        Assert.Equal(4, c.PerMode["legacy"].Rows);
        Assert.Equal("float64", c.PerMode["legacy"].Columns[1].Type);
        Assert.Equal("int64", c.PerMode["modern"].Columns[1].Type);
        Assert.Equal("utf8", c.PerMode["modern"].Columns[0].Type);
    }

    [Fact]
    public void Type_labels_from_type_of_get_their_own_hint()
    {
        // Spec §2.2: type_of(c) gives 'object' under boxed and 'utf8' under arrow.
        var a = Table(L, ("kind", [S("object"), S("object")]));
        var b = Table(M, ("kind", [S("utf8"), S("utf8")]));
        var f = Single(Diff(Run(L, ("t", a)), Run(M, ("t", b))), FindingKind.Value, "kind");
        Assert.Equal(2, f.Count);
        Assert.Equal(MigrationHints.TypeLabelValue, f.Hint);
    }
}
