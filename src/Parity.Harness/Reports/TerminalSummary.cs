using System.Text;
using Parity.Harness.Findings;
using Parity.Harness.Reports.Internal;

namespace Parity.Harness.Reports;

/// <summary>
/// The summary printed after <c>run</c> and <c>check</c> (docs/reports.md, "Terminal"): per script one line
/// with its status and counts, then what needs a decision in full (new and changed findings with samples and
/// hint, golden mismatches), resolved findings one line each, then accepted and expected findings as one
/// count line per status (one line each with <c>--show-accepted</c>). The last line counts scripts failed, findings by status and golden
/// mismatches; after a failure one more line says what to do next. Colour (ANSI SGR) only when asked; data
/// values never carry control characters to the terminal (they are shown as visible escapes).
/// </summary>
public static class TerminalSummary
{
    private const string Red = "\u001b[31m";
    private const string Green = "\u001b[32m";
    private const string Yellow = "\u001b[33m";
    private const string Dim = "\u001b[2m";
    private const string Bold = "\u001b[1m";
    private const string Reset = "\u001b[0m";

    public static void Write(GateReport report, TextWriter output, bool colour) => Write(report, output, colour, TerminalOptions.Default);

    /// <summary>
    /// Writes the summary. Accepted findings are one count line per script unless
    /// <see cref="TerminalOptions.ShowAccepted"/>; golden mismatches list up to
    /// <see cref="TerminalOptions.MaxDiffRows"/> rows each, changed cells in <c>[brackets]</c>.
    /// </summary>
    public static void Write(GateReport report, TextWriter output, bool colour, TerminalOptions options)
    {
        foreach (var script in report.Scripts)
        {
            var sb = new StringBuilder();
            var failed = script.Failed;
            Paint(sb, failed ? "FAIL" : "PASS", failed ? Red + Bold : Green + Bold, colour);
            sb.Append("  ").Append(SafeText.Visible(script.Script))
                .Append("  ").Append(ReportFacts.Int(script.Checkpoints.Count)).Append(script.Checkpoints.Count == 1 ? " checkpoint" : " checkpoints")
                .Append(", findings: ").Append(ReportFacts.KindSummary(ReportFacts.CountByKind(script)));
            AppendStatusCounts(sb, script);
            if (script.GoldenMismatches.Count > 0)
                sb.Append(", ").Append(ReportFacts.Int(script.GoldenMismatches.Count)).Append(script.GoldenMismatches.Count == 1 ? " golden mismatch" : " golden mismatches");
            output.WriteLine(sb.ToString());
            if (options.Quiet) continue;

            // What needs a decision first and in full; the rest folded into one count line per status.
            foreach (var f in script.Findings)
                if (NeedsDecision(f)) WriteFinding(output, f, colour);
            foreach (var m in script.GoldenMismatches)
                WriteMismatch(output, m, colour, options.MaxDiffRows);
            // A resolved finding is news (something went away): one line each.
            foreach (var f in script.Findings)
                if (f.Status == FindingStatus.Resolved) WriteFinding(output, f, colour);
            foreach (var status in Folded)
            {
                var kinds = new int[ReportFacts.Kinds.Count];
                var n = 0;
                foreach (var f in script.Findings)
                {
                    if (f.Status != status) continue;
                    if (options.ShowAccepted) WriteFinding(output, f, colour);
                    kinds[(int)f.Kind]++;
                    n++;
                }
                if (n > 0 && !options.ShowAccepted)
                    output.WriteLine("  " + ReportFacts.Label(status) + ": " + ReportFacts.Int(n) + (n == 1 ? " finding (" : " findings (") + ReportFacts.KindSummary(kinds) + "); --show-accepted lists them");
            }
        }
        WriteLastLines(report, output, colour);
    }

    private static readonly FindingStatus[] Folded = [FindingStatus.Accepted, FindingStatus.Expected];

    private static bool NeedsDecision(Finding f) => f.Status is FindingStatus.New or FindingStatus.Changed;

    /// <summary>
    /// <c>failed: 1 of 5 scripts; findings: 3 new, 40 accepted, 12 expected; 18 golden mismatches</c>, then,
    /// after a failure, what to do next.
    /// </summary>
    private static void WriteLastLines(GateReport report, TextWriter output, bool colour)
    {
        var failedScripts = 0;
        var mismatches = 0;
        var byStatus = new int[Enum.GetValues<FindingStatus>().Length];
        foreach (var s in report.Scripts)
        {
            if (s.Failed) failedScripts++;
            mismatches += s.GoldenMismatches.Count;
            foreach (var f in s.Findings) byStatus[(int)f.Status]++;
        }
        var total = new StringBuilder();
        Paint(total, report.Failed ? "failed" : "passed", report.Failed ? Red + Bold : Green + Bold, colour);
        var scripts = report.Scripts.Count;
        total.Append(": ");
        if (report.Failed) total.Append(ReportFacts.Int(failedScripts)).Append(" of ");
        total.Append(ReportFacts.Int(scripts)).Append(scripts == 1 ? " script" : " scripts");
        var parts = new List<string>();
        foreach (var status in new[] { FindingStatus.New, FindingStatus.Changed, FindingStatus.Accepted, FindingStatus.Expected, FindingStatus.Resolved })
            if (byStatus[(int)status] > 0) parts.Add(ReportFacts.Int(byStatus[(int)status]) + " " + ReportFacts.Label(status));
        total.Append("; findings: ").Append(parts.Count == 0 ? "none" : string.Join(", ", parts));
        total.Append("; ").Append(ReportFacts.Int(mismatches)).Append(mismatches == 1 ? " golden mismatch" : " golden mismatches");
        output.WriteLine(total.ToString());
        if (!report.Failed) return;
        output.WriteLine(mismatches > 0
            ? "next: read the golden mismatches above; if the change is intended, run `parity accept` on the failed scripts (`parity accept --prune DIR` for stale folders), else fix the script or data"
            : "next: read the new and changed findings above; accept intended ones with `parity accept SCRIPT`, or add an expect rule to parity.json for a whole class of them");
    }

    private static void WriteMismatch(TextWriter output, GoldenMismatch m, bool colour, int maxRows)
    {
        var sb = new StringBuilder("  ");
        Paint(sb, "golden", Red, colour);
        sb.Append("   mode ").Append(SafeText.Visible(m.Mode)).Append(", ")
            .Append(m.Checkpoint is null ? "statement records" : "checkpoint '" + SafeText.Visible(m.Checkpoint) + "'")
            .Append(": ").Append(SafeText.Visible(GoldenDiffText.Summary(m)));
        output.WriteLine(sb.ToString());
        foreach (var line in GoldenDiffText.Lines(m, maxRows))
            output.WriteLine("      " + SafeText.Visible(line));
    }

    private static void AppendStatusCounts(StringBuilder sb, ScriptResult script)
    {
        var parts = new List<string>();
        foreach (var status in new[] { FindingStatus.New, FindingStatus.Changed, FindingStatus.Accepted, FindingStatus.Expected, FindingStatus.Resolved })
        {
            var n = ReportFacts.CountByStatus(script, status);
            if (n > 0) parts.Add(ReportFacts.Int(n) + " " + ReportFacts.Label(status));
        }
        if (parts.Count > 0) sb.Append(" (").Append(string.Join(", ", parts)).Append(')');
    }

    private static void WriteFinding(TextWriter output, Finding f, bool colour)
    {
        var sb = new StringBuilder("  ");
        var kind = f.KindLabel;
        Paint(sb, kind.PadRight(8), Bold, colour);
        sb.Append("line ").Append(ReportFacts.Int(f.Line));
        if (f.Checkpoint is not null) sb.Append("  checkpoint '").Append(SafeText.Visible(f.Checkpoint)).Append('\'');
        if (f.Column is not null) sb.Append("  column '").Append(SafeText.Visible(f.Column)).Append('\'');
        sb.Append("  x").Append(ReportFacts.Int(f.Count));
        if (f.AcceptedCount is { } a && a != f.Count) sb.Append(" (accepted x").Append(ReportFacts.Int(a)).Append(')');
        sb.Append("  ");
        var status = ReportFacts.Label(f.Status);
        Paint(sb, status, f.Status switch
        {
            FindingStatus.New or FindingStatus.Changed => Red,
            FindingStatus.Accepted => Green,
            _ => Dim,
        }, colour);
        if (f.AlsoAt.Count > 0) sb.Append(" at ").Append(ReportFacts.Int(f.AlsoAt.Count + 1)).Append(" checkpoints");
        sb.Append("  ").Append(SafeText.Visible(f.Message));
        output.WriteLine(sb.ToString());
        if (f.AlsoAt.Count > 0 && f.Status is FindingStatus.New or FindingStatus.Changed)
            output.WriteLine("      also at " + SafeText.Visible(ReportFacts.AlsoAtText(f)));

        // Accepted and resolved findings stay one line each: a reviewer reads samples for what needs a decision.
        var samples = f.Status is FindingStatus.New or FindingStatus.Changed ? f.Samples : [];
        foreach (var sample in samples)
        {
            sb.Clear();
            // Statement-level samples (aliasing sets, warnings) have no row.
            sb.Append("    ");
            if (sample.Row is { } r) sb.Append("  row ").Append(ReportFacts.Int(r)).Append(':');
            for (var i = 0; i < f.Modes.Count; i++)
            {
                sb.Append(i == 0 ? "  " : "  |  ");
                Paint(sb, SafeText.Visible(f.Modes[i]), Dim, colour);
                sb.Append(' ').Append(SafeText.Visible(ReportFacts.SampleValue(sample, i)));
            }
            output.WriteLine(sb.ToString());
        }
        if (f.Hint.Length > 0 && f.Status is FindingStatus.New or FindingStatus.Changed)
        {
            sb.Clear();
            sb.Append("      ");
            Paint(sb, "hint: " + SafeText.Visible(f.Hint), Yellow, colour);
            output.WriteLine(sb.ToString());
        }
    }

    private static void Paint(StringBuilder sb, string text, string sgr, bool colour)
    {
        if (colour) sb.Append(sgr).Append(text).Append(Reset);
        else sb.Append(text);
    }
}
