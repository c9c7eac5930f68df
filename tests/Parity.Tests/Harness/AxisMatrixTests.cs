using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Harness.Gate;
using Parity.Harness.Reports;
using Parity.Harness.Running;

namespace Parity.Tests.Harness;

/// <summary><c>parity matrix</c>: the minimal sets of axes whose flip alone reproduces each finding.</summary>
public sealed class AxisMatrixTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-matrix-" + Guid.NewGuid().ToString("N"));

    public AxisMatrixTests() => Directory.CreateDirectory(_dir);

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    private static HashSet<string>[] Flipped(params int[] masksWithKey)
    {
        var sets = new HashSet<string>[8];
        for (var m = 1; m < 8; m++) sets[m] = new HashSet<string>(StringComparer.Ordinal);
        foreach (var m in masksWithKey) sets[m].Add("k");
        return sets;
    }

    [Theory]
    // Bits: 1 strings, 2 missing, 4 writes; 7 (all three) is modern and always shows the finding.
    [InlineData(new[] { 4, 5, 6, 7 }, "writes")]
    [InlineData(new[] { 1, 2, 3, 5, 6, 7 }, "strings | missing")]
    [InlineData(new[] { 3, 7 }, "strings+missing")]
    [InlineData(new[] { 7 }, "strings+missing+writes")]
    [InlineData(new[] { 1, 3, 5, 6, 7 }, "strings | missing+writes")]
    public void Causes_are_the_minimal_reproducing_sets(int[] masks, string expected)
    {
        Assert.Equal(expected, AxisMatrix.CauseText(AxisMatrix.Causes(Flipped(masks), "k")));
    }

    [Fact]
    public void A_real_script_gets_one_cause_per_axis_and_either_for_the_nan_text()
    {
        // Spec §2.2: text(x) gives 'nan' only under boxed+nan; arrow+nan keeps NaN and null modes keep null,
        // so flipping strings alone or missing alone already shows the missing difference.
        File.WriteAllText(Path.Combine(_dir, "t.csv"), "id,name,age\n1,Åsa,34\n2,Bo,\n3,Zoë,17\n");
        File.WriteAllText(Path.Combine(_dir, "m.parity"), """
            load t from 't.csv'
            set (t take 2).age = 0 where id = 1
            let labels = t add age_text = text(age)
            check labels
            """);
        var outcome = new GateSession(new GateOptions { WorkingDirectory = _dir, Modes = Mode.All }).RunScript(Path.Combine(_dir, "m.parity"));
        var rows = AxisMatrix.Build(outcome.Runs, outcome.Script, DiffOptions.Default);
        string CauseOf(FindingKind kind, string? column) =>
            AxisMatrix.CauseText(rows.Single(r => r.Finding.Kind == kind && r.Finding.Column == column).Causes);
        Assert.Equal("writes", CauseOf(FindingKind.Alias, null));
        Assert.Equal("strings", CauseOf(FindingKind.Type, "name"));
        Assert.Equal("missing", CauseOf(FindingKind.Type, "age"));
        Assert.Equal("strings | missing", CauseOf(FindingKind.Missing, "age_text"));

        var json = MatrixJsonWriter.Render([(outcome.Script, rows)]);
        Assert.Contains("\"causes\": [\n            [\n              \"strings\"\n            ],\n            [\n              \"missing\"\n            ]\n          ]", json, StringComparison.Ordinal);
    }
}
