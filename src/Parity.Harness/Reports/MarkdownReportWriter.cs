using Parity.Harness.Storage;
using System.Text;
using Parity.Harness.Findings;
using Parity.Harness.Reports.Internal;

namespace Parity.Harness.Reports;

/// <summary>
/// <c>report.md</c>: a pull-request comment. A summary table (script, checkpoints, findings per kind,
/// golden mismatches, status), then per script the details of each finding (kind, script, line,
/// checkpoint, column, count, status, message, hint, and a samples table with each mode's value side by
/// side) and the golden mismatches. Every embedded value is escaped by <see cref="MarkdownText"/>.
/// </summary>
public sealed class MarkdownReportWriter : IReportWriter
{
    public string Format => "md";

    public string FileName => "report.md";

    public void Write(GateReport report, string outDir) => AtomicFile.WriteAllText(Path.Combine(outDir, FileName), Render(report));

    /// <summary>Most rows listed per golden mismatch (<c>--max-diff-rows</c>); counts are always exact.</summary>
    public int MaxDiffRows { get; init; } = GoldenDiffText.DefaultMaxRows;

    public string Render(GateReport report)
    {
        var sb = new StringBuilder();
        sb.Append("## Parity ").Append(MarkdownText.Inline(report.Command)).Append(": ")
            .Append(report.Failed ? "**failed**" : "**passed**").Append('\n').Append('\n');
        if (report.GeneratedAt is { } at)
            sb.Append("Generated ").Append(MarkdownText.Inline(at)).Append(".\n\n");

        WriteSummary(sb, report);

        foreach (var script in report.Scripts)
        {
            sb.Append('\n').Append("### ").Append(MarkdownText.Inline(script.Script)).Append('\n').Append('\n');
            sb.Append("Modes: ").Append(MarkdownText.Inline(string.Join(", ", script.Modes))).Append(". Status: **")
                .Append(ReportFacts.Status(script)).Append("**.\n");
            if (script.Findings.Count == 0 && script.GoldenMismatches.Count == 0)
                sb.Append("\nNo findings.\n");
            var number = 0;
            foreach (var finding in script.Findings)
                WriteFinding(sb, finding, ++number);
            if (script.GoldenMismatches.Count > 0)
            {
                sb.Append("\n#### Golden mismatches\n");
                foreach (var m in script.GoldenMismatches)
                    WriteMismatch(sb, m, MaxDiffRows);
            }
        }
        return sb.ToString();
    }

    /// <summary>
    /// A golden mismatch: the exact counts, the schema change, then a table with the golden row above the
    /// current row for each listed row; changed cells are bold and marked with a trailing <c>✱</c>, so the mark
    /// does not rest on colour or emphasis alone.
    /// </summary>
    private static void WriteMismatch(StringBuilder sb, GoldenMismatch m, int maxRows)
    {
        sb.Append("\n- **mode:** ").Append(MarkdownText.Inline(m.Mode))
            .Append(", ").Append(m.Checkpoint is null ? "**statement records**" : "**checkpoint:** " + MarkdownText.Inline(m.Checkpoint))
            .Append(" (").Append(MarkdownText.Inline(m.Kind)).Append("): ").Append(MarkdownText.Inline(GoldenDiffText.Summary(m))).Append('\n');
        var schema = GoldenDiffText.SchemaLine(m.Schema);
        if (schema is not null) sb.Append("  ").Append(MarkdownText.Inline(schema)).Append('\n');
        if (m.Kind == GoldenMismatchKinds.Records)
        {
            sb.Append("\n| record | golden | now |\n|---|---|---|\n");
            foreach (var c in m.Changes)
                sb.Append("| ").Append(MarkdownText.Inline(c.Column)).Append(" | ").Append(MarkdownText.Inline(c.Golden ?? "(none)"))
                    .Append(" | ").Append(MarkdownText.Inline(c.Now ?? "(none)")).Append(" |\n");
            return;
        }
        if (m.Rows.Count == 0)
        {
            if (m.Excerpt.Length > 0) sb.Append('\n').Append(MarkdownText.Fenced(m.Excerpt, "diff"));
            return;
        }
        var columns = new List<string>(m.NowColumns);
        foreach (var g in m.GoldenColumns)
            if (!columns.Contains(g)) columns.Add(g);
        sb.Append("\n| side | row |");
        foreach (var c in columns) sb.Append(' ').Append(MarkdownText.Inline(c)).Append(" |");
        sb.Append("\n|---|---:|");
        foreach (var _ in columns) sb.Append("---|");
        sb.Append('\n');
        var listed = Math.Min(maxRows, m.Rows.Count);
        for (var i = 0; i < listed; i++)
        {
            var r = m.Rows[i];
            if (r.Golden is not null) Side(sb, r.Now is null ? "golden (removed)" : "golden", r.RowGolden, r.Golden, m.GoldenColumns, columns, r.ChangedColumns);
            if (r.Now is not null) Side(sb, r.Golden is null ? "now (added)" : "now", r.RowNow, r.Now, m.NowColumns, columns, r.ChangedColumns);
        }
        var total = m.RowsChanged + m.RowsAdded + m.RowsRemoved;
        if (total > listed)
            sb.Append("\n").Append(ReportFacts.Int(total - listed)).Append(" more rows not listed (`--max-diff-rows N` lists more; `report.json` has up to 1,000 changes).\n");
    }

    private static void Side(StringBuilder sb, string side, long? row, IReadOnlyList<string> cells, IReadOnlyList<string> own, List<string> columns, IReadOnlyList<string> changed)
    {
        sb.Append("| ").Append(side).Append(" | ").Append(row is { } r ? ReportFacts.Int(r) : "").Append(" |");
        foreach (var c in columns)
        {
            var at = -1;
            for (var k = 0; k < own.Count; k++)
                if (string.Equals(own[k], c, StringComparison.Ordinal)) { at = k; break; }
            sb.Append(' ');
            if (at < 0 || at >= cells.Count) sb.Append("(no column)");
            else if (GoldenDiffText.Contains(changed, c)) sb.Append("**").Append(MarkdownText.Inline(cells[at])).Append("** ✱");
            else sb.Append(MarkdownText.Inline(cells[at]));
            sb.Append(" |");
        }
        sb.Append('\n');
    }

    private static void WriteSummary(StringBuilder sb, GateReport report)
    {
        sb.Append("| script | checkpoints |");
        foreach (var kind in ReportFacts.Kinds)
            sb.Append(' ').Append(ReportFacts.Label(kind)).Append(" |");
        sb.Append(" golden | status |\n|---|---:|");
        foreach (var _ in ReportFacts.Kinds)
            sb.Append("---:|");
        sb.Append("---:|---|\n");
        foreach (var script in report.Scripts)
        {
            sb.Append("| ").Append(MarkdownText.Inline(script.Script)).Append(" | ").Append(ReportFacts.Int(script.Checkpoints.Count)).Append(" |");
            foreach (var n in ReportFacts.CountByKind(script))
                sb.Append(' ').Append(ReportFacts.Int(n)).Append(" |");
            sb.Append(' ').Append(ReportFacts.Int(script.GoldenMismatches.Count)).Append(" | ")
                .Append(script.Failed ? "**failed**" : "passed").Append(" |\n");
        }
        sb.Append("\nCounts are finding groups (resolved findings left out); each group's row count is in its details.\n");
    }

    private static void WriteFinding(StringBuilder sb, Finding f, int number)
    {
        sb.Append("\n#### ").Append(ReportFacts.Int(number)).Append(". ").Append(f.KindLabel).Append(" at ")
            .Append(MarkdownText.Inline(ReportFacts.Where(f)));
        if (f.Column is not null)
            sb.Append(", column ").Append(MarkdownText.Inline("'" + f.Column + "'"));
        sb.Append(" (").Append(ReportFacts.Label(f.Status)).Append(")\n\n");

        sb.Append("- **kind:** ").Append(f.KindLabel).Append('\n');
        sb.Append("- **script:** ").Append(MarkdownText.Inline(f.Script)).Append('\n');
        sb.Append("- **line:** ").Append(ReportFacts.Int(f.Line)).Append('\n');
        sb.Append("- **checkpoint:** ").Append(f.Checkpoint is null ? "(statement)" : MarkdownText.Inline(f.Checkpoint)).Append('\n');
        if (f.Checkpoint is null && f.Statement is not null) sb.Append("- **statement:** ").Append(MarkdownText.Inline(f.Statement)).Append('\n');
        sb.Append("- **column:** ").Append(f.Column is null ? "(whole frame)" : MarkdownText.Inline(f.Column)).Append('\n');
        if (f.AlsoAt.Count > 0) sb.Append("- **also at:** ").Append(MarkdownText.Inline(ReportFacts.AlsoAtText(f))).Append('\n');
        if (f.CausedBy is not null) sb.Append("- **caused by:** ").Append(MarkdownText.Inline(ReportFacts.CauseText(f) + " (" + f.CausedBy + ")")).Append('\n');
        sb.Append("- **count:** ").Append(ReportFacts.Int(f.Count));
        if (f.AcceptedCount is { } accepted && accepted != f.Count)
            sb.Append(" (accepted: ").Append(ReportFacts.Int(accepted)).Append(')');
        sb.Append('\n');
        sb.Append("- **status:** ").Append(ReportFacts.Label(f.Status)).Append('\n');
        sb.Append("- **message:** ").Append(MarkdownText.Inline(f.Message)).Append('\n');
        sb.Append("- **hint:** ").Append(MarkdownText.Inline(f.Hint)).Append('\n');

        if (f.Samples.Count == 0) return;
        sb.Append("\n| row |");
        foreach (var mode in f.Modes)
            sb.Append(' ').Append(MarkdownText.Inline(mode)).Append(" |");
        sb.Append("\n|---:|");
        foreach (var _ in f.Modes)
            sb.Append("---|");
        sb.Append('\n');
        foreach (var sample in f.Samples)
        {
            sb.Append("| ").Append(ReportFacts.Row(sample)).Append(" |");
            for (var m = 0; m < f.Modes.Count; m++)
                sb.Append(' ').Append(MarkdownText.Inline(ReportFacts.SampleValue(sample, m))).Append(" |");
            sb.Append('\n');
        }
    }
}
