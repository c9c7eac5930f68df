using System.Text;
using Parity.Harness.Findings;
using Parity.Harness.Reports.Internal;

namespace Parity.Harness.Reports;

/// <summary>
/// The plain-text form of a golden mismatch shared by the terminal and JUnit reports: a one-line summary with
/// the exact counts, then the schema changes and the listed rows side by side (golden row, then current row),
/// changed cells in <c>[brackets]</c> (no cell's text form starts with a bracket, so the mark is unambiguous),
/// and how many rows were left out. Callers escape the lines for their medium.
/// </summary>
public static class GoldenDiffText
{
    /// <summary>Rows listed per checkpoint in the terminal and Markdown unless <c>--max-diff-rows</c> says otherwise.</summary>
    public const int DefaultMaxRows = 20;

    public static string Summary(GoldenMismatch m)
    {
        if (m.Kind is not (GoldenMismatchKinds.Frame or GoldenMismatchKinds.Schema)) return m.Message;
        var sb = new StringBuilder();
        sb.Append(ReportFacts.Int(m.RowsChanged)).Append(m.RowsChanged == 1 ? " row changed, " : " rows changed, ")
            .Append(ReportFacts.Int(m.RowsAdded)).Append(" added, ").Append(ReportFacts.Int(m.RowsRemoved)).Append(" removed; ")
            .Append(ReportFacts.Int(m.CellsChanged)).Append(m.CellsChanged == 1 ? " cell changed" : " cells changed");
        if (m.Columns.Count > 0)
        {
            sb.Append(" (");
            for (var i = 0; i < m.Columns.Count; i++)
            {
                if (i > 0) sb.Append(", ");
                sb.Append(m.Columns[i].Key).Append(' ').Append(ReportFacts.Int(m.Columns[i].Value));
            }
            sb.Append(')');
        }
        sb.Append("; rows: ").Append(m.RowsGolden is { } g ? ReportFacts.Int(g) : "-").Append(" in golden, ")
            .Append(m.RowsNow is { } n ? ReportFacts.Int(n) : "-").Append(" now");
        if (m.Keys.Count > 0) sb.Append("; matched by key ").Append(string.Join(", ", m.Keys));
        return sb.ToString();
    }

    /// <summary>The schema change in one line, or null when the schema is unchanged.</summary>
    public static string? SchemaLine(GoldenSchemaChange s)
    {
        if (s.IsEmpty) return null;
        var parts = new List<string>();
        if (s.Added.Count > 0) parts.Add("added " + Names(s.Added));
        if (s.Removed.Count > 0) parts.Add("removed " + Names(s.Removed));
        foreach (var r in s.Retyped) parts.Add("retyped '" + r.Column + "' " + r.Golden + " -> " + r.Now);
        if (s.Moved.Count > 0) parts.Add("order changed for " + Names(s.Moved));
        return "schema: " + string.Join("; ", parts);
    }

    public static IReadOnlyList<string> Lines(GoldenMismatch m, int maxRows)
    {
        var lines = new List<string>();
        var schema = SchemaLine(m.Schema);
        if (schema is not null) lines.Add(schema);
        if (m.Kind == GoldenMismatchKinds.Records)
        {
            foreach (var c in m.Changes)
            {
                lines.Add(c.Column ?? "");
                lines.Add("  golden: " + (c.Golden ?? "(none)"));
                lines.Add("  now:    " + (c.Now ?? "(none)"));
            }
            return lines;
        }
        if (m.Rows.Count == 0)
        {
            foreach (var line in m.Excerpt.Replace("\r\n", "\n", StringComparison.Ordinal).Split('\n'))
                if (line.Length > 0) lines.Add(line);
            return lines;
        }
        var listed = Math.Min(maxRows, m.Rows.Count);
        if (listed > 0) lines.Add("changed cells in [brackets]; rows from 0");
        for (var i = 0; i < listed; i++)
        {
            var r = m.Rows[i];
            var what = r.Golden is null ? "  (added)" : r.Now is null ? "  (removed)" : "";
            if (r.Golden is not null) lines.Add("golden row " + ReportFacts.Int(r.RowGolden ?? 0) + ": " + Row(r.Golden, m.GoldenColumns, r.ChangedColumns) + (r.Now is null ? what : ""));
            if (r.Now is not null) lines.Add("now    row " + ReportFacts.Int(r.RowNow ?? 0) + ": " + Row(r.Now, m.NowColumns, r.ChangedColumns) + (r.Golden is null ? what : ""));
        }
        var total = m.RowsChanged + m.RowsAdded + m.RowsRemoved;
        if (total > listed)
            lines.Add("... " + ReportFacts.Int(total - listed) + " more " + (total - listed == 1 ? "row" : "rows") + " not listed (--max-diff-rows N lists more; report.json has up to 1,000 changes)");
        return lines;
    }

    /// <summary>Cells joined by <c> | </c>, the changed ones in brackets.</summary>
    public static string Row(IReadOnlyList<string> cells, IReadOnlyList<string> columns, IReadOnlyList<string> changed)
    {
        var sb = new StringBuilder();
        for (var c = 0; c < cells.Count; c++)
        {
            if (c > 0) sb.Append(" | ");
            var mark = c < columns.Count && Contains(changed, columns[c]);
            if (mark) sb.Append('[');
            sb.Append(cells[c]);
            if (mark) sb.Append(']');
        }
        return sb.ToString();
    }

    public static bool Contains(IReadOnlyList<string> names, string name)
    {
        foreach (var n in names)
            if (string.Equals(n, name, StringComparison.Ordinal)) return true;
        return false;
    }

    private static string Names(IReadOnlyList<string> names)
    {
        var q = new string[names.Count];
        for (var i = 0; i < q.Length; i++) q[i] = "'" + names[i] + "'";
        return string.Join(", ", q);
    }
}
