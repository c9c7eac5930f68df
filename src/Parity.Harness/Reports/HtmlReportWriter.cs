using Parity.Harness.Storage;
using System.Security.Cryptography;
using System.Text;
using Parity.Harness.Findings;
using Parity.Harness.Reports.Internal;

namespace Parity.Harness.Reports;

/// <summary>
/// <c>report.html</c>: one self-contained page (inline CSS and script, no external resources) with the
/// summary, a filter by finding kind, each finding with its samples side by side, the checkpoints and the
/// golden mismatches. Every embedded value is HTML-escaped by <see cref="HtmlText"/>; no data goes into the
/// script block (the script reads the page's own elements), and a Content-Security-Policy allows only that
/// one script by its hash, so even a value that escaped escaping could not run.
/// The filter also reads <c>#kinds=type,value</c> from the address, so a filtered view can be linked.
/// </summary>
public sealed class HtmlReportWriter : IReportWriter
{
    private const string Style = """
body { font: 14px/1.45 system-ui, sans-serif; margin: 1.5em auto; max-width: 72em; padding: 0 1em; color: #1b1f24; }
h1 { font-size: 1.5em; } h2 { font-size: 1.2em; margin-top: 2em; border-bottom: 1px solid #d0d7de; } h3 { font-size: 1em; margin: 0 0 .4em; }
table { border-collapse: collapse; margin: .5em 0; } th, td { border: 1px solid #d0d7de; padding: .2em .6em; text-align: left; vertical-align: top; }
td.n { text-align: right; font-variant-numeric: tabular-nums; }
.v { font-family: ui-monospace, monospace; white-space: pre-wrap; word-break: break-all; }
.failed { color: #b42318; font-weight: bold; } .passed { color: #1a7f37; font-weight: bold; }
.finding { border: 1px solid #d0d7de; border-left: 4px solid #8c959f; border-radius: 4px; padding: .6em .9em; margin: .8em 0; }
.finding.new, .finding.changed { border-left-color: #b42318; } .finding.accepted { border-left-color: #1a7f37; } .finding.resolved { opacity: .7; }
.kind { display: inline-block; min-width: 5em; font-weight: bold; }
dl { display: grid; grid-template-columns: max-content 1fr; gap: .1em 1em; margin: .3em 0; } dt { color: #57606a; } dd { margin: 0; }
fieldset { border: 1px solid #d0d7de; border-radius: 4px; } label { margin-right: 1em; white-space: nowrap; }
pre { background: #f6f8fa; padding: .5em; overflow-x: auto; }
td.changed { background: #fff1c2; font-weight: bold; } td.changed del, td.changed ins { text-decoration-thickness: 2px; }
""";

    private const string Script = """
(function () {
  var boxes = Array.prototype.slice.call(document.querySelectorAll('#kind-filter input[type=checkbox]'));
  var findings = Array.prototype.slice.call(document.querySelectorAll('.finding'));
  var wanted = /kinds=([a-z,]*)/.exec(window.location.hash);
  if (wanted) {
    var list = wanted[1].split(',');
    boxes.forEach(function (b) { b.checked = list.indexOf(b.value) >= 0; });
  }
  function apply() {
    var on = {};
    boxes.forEach(function (b) { on[b.value] = b.checked; });
    var shown = 0;
    findings.forEach(function (f) {
      var visible = on[f.getAttribute('data-kind')] === true;
      f.hidden = !visible;
      if (visible) { shown++; }
    });
    document.getElementById('shown-count').textContent = 'Showing ' + shown + ' of ' + findings.length + ' findings.';
  }
  boxes.forEach(function (b) { b.addEventListener('change', apply); });
  apply();
})();
""";

    private static readonly string ScriptHash = Convert.ToBase64String(SHA256.HashData(Encoding.UTF8.GetBytes(Script)));

    public string Format => "html";

    public string FileName => "report.html";

    public void Write(GateReport report, string outDir) => AtomicFile.WriteAllText(Path.Combine(outDir, FileName), Render(report));

    /// <summary>Most rows listed per golden mismatch (<c>--max-diff-rows</c>); counts are always exact.</summary>
    public int MaxDiffRows { get; init; } = GoldenDiffText.DefaultMaxRows;

    public string Render(GateReport report)
    {
        var sb = new StringBuilder();
        sb.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        sb.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; script-src 'sha256-")
            .Append(ScriptHash).Append("'\">\n");
        sb.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        sb.Append("<title>Parity report</title>\n<style>\n").Append(Style).Append("</style>\n</head>\n<body>\n");
        sb.Append("<h1>Parity ").Append(H(report.Command)).Append(": <span class=\"").Append(ReportFacts.Status(report)).Append("\">")
            .Append(ReportFacts.Status(report)).Append("</span></h1>\n");
        if (report.GeneratedAt is { } at)
            sb.Append("<p>Generated ").Append(H(at)).Append(".</p>\n");

        WriteSummary(sb, report);
        WriteFilter(sb, report);

        foreach (var script in report.Scripts)
        {
            sb.Append("<section class=\"script\">\n<h2>").Append(H(script.Script)).Append(" <span class=\"").Append(ReportFacts.Status(script)).Append("\">")
                .Append(ReportFacts.Status(script)).Append("</span></h2>\n");
            sb.Append("<p>Modes: <span class=\"v\">").Append(H(string.Join(", ", script.Modes))).Append("</span></p>\n");
            if (script.Findings.Count == 0) sb.Append("<p>No findings.</p>\n");
            foreach (var f in script.Findings)
                WriteFinding(sb, f);
            WriteGolden(sb, script, MaxDiffRows);
            WriteCheckpoints(sb, script);
            sb.Append("</section>\n");
        }
        sb.Append("<script>").Append(Script).Append("</script>\n</body>\n</html>\n");
        return sb.ToString();
    }

    private static void WriteSummary(StringBuilder sb, GateReport report)
    {
        sb.Append("<table class=\"summary\">\n<thead><tr><th>script</th><th>checkpoints</th>");
        foreach (var kind in ReportFacts.Kinds)
            sb.Append("<th>").Append(ReportFacts.Label(kind)).Append("</th>");
        sb.Append("<th>golden</th><th>status</th></tr></thead>\n<tbody>\n");
        foreach (var script in report.Scripts)
        {
            sb.Append("<tr><td class=\"v\">").Append(H(script.Script)).Append("</td><td class=\"n\">").Append(ReportFacts.Int(script.Checkpoints.Count)).Append("</td>");
            foreach (var n in ReportFacts.CountByKind(script))
                sb.Append("<td class=\"n\">").Append(ReportFacts.Int(n)).Append("</td>");
            sb.Append("<td class=\"n\">").Append(ReportFacts.Int(script.GoldenMismatches.Count)).Append("</td><td class=\"")
                .Append(ReportFacts.Status(script)).Append("\">").Append(ReportFacts.Status(script)).Append("</td></tr>\n");
        }
        sb.Append("</tbody>\n</table>\n");
    }

    private static void WriteFilter(StringBuilder sb, GateReport report)
    {
        // Counts here include resolved findings: the filter hides and shows every finding on the page.
        var counts = new int[ReportFacts.Kinds.Count];
        var total = 0;
        foreach (var s in report.Scripts)
            foreach (var f in s.Findings) { counts[(int)f.Kind]++; total++; }
        sb.Append("<fieldset id=\"kind-filter\"><legend>Show finding kinds</legend>\n");
        for (var i = 0; i < counts.Length; i++)
        {
            var label = ReportFacts.Label(ReportFacts.Kinds[i]);
            sb.Append("<label><input type=\"checkbox\" name=\"kind\" value=\"").Append(label).Append("\" checked> ")
                .Append(label).Append(" (").Append(ReportFacts.Int(counts[i])).Append(")</label>\n");
        }
        sb.Append("<p id=\"shown-count\">Showing ").Append(ReportFacts.Int(total)).Append(" of ").Append(ReportFacts.Int(total)).Append(" findings.</p>\n</fieldset>\n");
    }

    private static void WriteFinding(StringBuilder sb, Finding f)
    {
        var status = ReportFacts.Label(f.Status);
        sb.Append("<article class=\"finding ").Append(status).Append("\" data-kind=\"").Append(f.KindLabel).Append("\" data-status=\"").Append(status).Append("\">\n");
        sb.Append("<h3><span class=\"kind\">").Append(f.KindLabel).Append("</span> ").Append(H(ReportFacts.Where(f)));
        if (f.Column is not null) sb.Append(", column <span class=\"v\">").Append(H(f.Column)).Append("</span>");
        sb.Append(" — ").Append(status).Append("</h3>\n<dl>\n");
        Field(sb, "kind", f.KindLabel);
        Field(sb, "script", H(f.Script));
        Field(sb, "line", ReportFacts.Int(f.Line));
        Field(sb, "checkpoint", f.Checkpoint is null ? "(statement)" : "<span class=\"v\">" + H(f.Checkpoint) + "</span>");
        if (f.Checkpoint is null && f.Statement is not null) Field(sb, "statement", "<span class=\"v\">" + H(f.Statement) + "</span>");
        Field(sb, "column", f.Column is null ? "(whole frame)" : "<span class=\"v\">" + H(f.Column) + "</span>");
        if (f.AlsoAt.Count > 0) Field(sb, "also at", H(ReportFacts.AlsoAtText(f)));
        if (f.CausedBy is not null) Field(sb, "caused by", H(ReportFacts.CauseText(f) + " (" + f.CausedBy + ")"));
        Field(sb, "count", ReportFacts.Int(f.Count) + (f.AcceptedCount is { } a && a != f.Count ? " (accepted: " + ReportFacts.Int(a) + ")" : ""));
        Field(sb, "status", status);
        Field(sb, "message", H(f.Message));
        Field(sb, "hint", H(f.Hint));
        sb.Append("</dl>\n");
        if (f.Samples.Count > 0)
        {
            sb.Append("<table class=\"samples\">\n<thead><tr><th>row</th>");
            foreach (var mode in f.Modes)
                sb.Append("<th>").Append(H(mode)).Append("</th>");
            sb.Append("</tr></thead>\n<tbody>\n");
            foreach (var sample in f.Samples)
            {
                sb.Append("<tr><td class=\"n\">").Append(ReportFacts.Row(sample)).Append("</td>");
                for (var m = 0; m < f.Modes.Count; m++)
                    sb.Append("<td class=\"v\">").Append(H(ReportFacts.SampleValue(sample, m))).Append("</td>");
                sb.Append("</tr>\n");
            }
            sb.Append("</tbody>\n</table>\n");
        }
        sb.Append("</article>\n");
    }

    /// <summary>
    /// Golden mismatches: counts, schema change and a table with the golden row above the current row; a changed
    /// cell is struck through (<c>del</c>) on the golden side and underlined (<c>ins</c>) on the current side,
    /// with a trailing <c>✱</c>, so the mark does not rest on colour.
    /// </summary>
    private static void WriteGolden(StringBuilder sb, ScriptResult script, int maxRows)
    {
        if (script.GoldenMismatches.Count == 0) return;
        sb.Append("<h3>Golden mismatches</h3>\n");
        foreach (var m in script.GoldenMismatches)
        {
            sb.Append("<div class=\"golden\"><p>mode <span class=\"v\">").Append(H(m.Mode)).Append("</span>, ")
                .Append(m.Checkpoint is null ? "statement records" : "checkpoint <span class=\"v\">" + H(m.Checkpoint) + "</span>")
                .Append(" (").Append(H(m.Kind)).Append("): ").Append(H(GoldenDiffText.Summary(m))).Append("</p>\n");
            var schema = GoldenDiffText.SchemaLine(m.Schema);
            if (schema is not null) sb.Append("<p>").Append(H(schema)).Append("</p>\n");
            if (m.Kind == GoldenMismatchKinds.Records)
            {
                sb.Append("<table class=\"golden-diff\">\n<thead><tr><th>record</th><th>golden</th><th>now</th></tr></thead>\n<tbody>\n");
                foreach (var c in m.Changes)
                    sb.Append("<tr><td class=\"v\">").Append(H(c.Column)).Append("</td><td class=\"v changed\"><del>").Append(H(c.Golden ?? "(none)"))
                        .Append("</del></td><td class=\"v changed\"><ins>").Append(H(c.Now ?? "(none)")).Append("</ins></td></tr>\n");
                sb.Append("</tbody>\n</table>\n</div>\n");
                continue;
            }
            if (m.Rows.Count == 0)
            {
                if (m.Excerpt.Length > 0)
                {
                    sb.Append("<pre>");
                    var lines = m.Excerpt.Replace("\r\n", "\n", StringComparison.Ordinal).Split('\n');
                    for (var i = 0; i < lines.Length; i++)
                    {
                        if (i > 0) sb.Append('\n');
                        sb.Append(H(lines[i]));
                    }
                    sb.Append("</pre>\n");
                }
                sb.Append("</div>\n");
                continue;
            }
            var columns = new List<string>(m.NowColumns);
            foreach (var g in m.GoldenColumns)
                if (!columns.Contains(g)) columns.Add(g);
            sb.Append("<table class=\"golden-diff\">\n<thead><tr><th>side</th><th>row</th>");
            foreach (var c in columns) sb.Append("<th>").Append(H(c)).Append("</th>");
            sb.Append("</tr></thead>\n<tbody>\n");
            var listed = Math.Min(maxRows, m.Rows.Count);
            for (var i = 0; i < listed; i++)
            {
                var r = m.Rows[i];
                if (r.Golden is not null) Side(sb, r.Now is null ? "golden (removed)" : "golden", r.RowGolden, r.Golden, m.GoldenColumns, columns, r.ChangedColumns, "del");
                if (r.Now is not null) Side(sb, r.Golden is null ? "now (added)" : "now", r.RowNow, r.Now, m.NowColumns, columns, r.ChangedColumns, "ins");
            }
            sb.Append("</tbody>\n</table>\n");
            var total = m.RowsChanged + m.RowsAdded + m.RowsRemoved;
            if (total > listed) sb.Append("<p>").Append(ReportFacts.Int(total - listed)).Append(" more rows not listed (--max-diff-rows N lists more; report.json has up to 1,000 changes).</p>\n");
            sb.Append("</div>\n");
        }
    }

    private static void Side(StringBuilder sb, string side, long? row, IReadOnlyList<string> cells, IReadOnlyList<string> own, List<string> columns, IReadOnlyList<string> changed, string tag)
    {
        sb.Append("<tr><td>").Append(side).Append("</td><td class=\"n\">").Append(row is { } r ? ReportFacts.Int(r) : "").Append("</td>");
        foreach (var c in columns)
        {
            var at = -1;
            for (var k = 0; k < own.Count; k++)
                if (string.Equals(own[k], c, StringComparison.Ordinal)) { at = k; break; }
            if (at < 0 || at >= cells.Count) sb.Append("<td>(no column)</td>");
            else if (GoldenDiffText.Contains(changed, c))
                sb.Append("<td class=\"v changed\"><").Append(tag).Append('>').Append(H(cells[at])).Append("</").Append(tag).Append("> ✱</td>");
            else sb.Append("<td class=\"v\">").Append(H(cells[at])).Append("</td>");
        }
        sb.Append("</tr>\n");
    }

    private static void WriteCheckpoints(StringBuilder sb, ScriptResult script)
    {
        if (script.Checkpoints.Count == 0) return;
        sb.Append("<details><summary>Checkpoints (").Append(ReportFacts.Int(script.Checkpoints.Count)).Append(")</summary>\n<table class=\"checkpoints\">\n<thead><tr><th>label</th><th>line</th>");
        foreach (var mode in script.Modes)
            sb.Append("<th>").Append(H(mode)).Append("</th>");
        sb.Append("</tr></thead>\n<tbody>\n");
        foreach (var c in script.Checkpoints)
        {
            sb.Append("<tr><td class=\"v\">").Append(H(c.Label)).Append("</td><td class=\"n\">").Append(ReportFacts.Int(c.Line)).Append("</td>");
            foreach (var mode in script.Modes)
            {
                sb.Append("<td>");
                if (c.PerMode.TryGetValue(mode, out var shape))
                {
                    sb.Append(ReportFacts.Int(shape.Rows)).Append(shape.Rows == 1 ? " row" : " rows");
                    foreach (var col in shape.Columns)
                        sb.Append("<br><span class=\"v\">").Append(H(col.Name)).Append("</span>: ").Append(H(col.Type));
                }
                else
                {
                    sb.Append("not reached");
                }
                sb.Append("</td>");
            }
            sb.Append("</tr>\n");
        }
        sb.Append("</tbody>\n</table>\n</details>\n");
    }

    private static void Field(StringBuilder sb, string name, string html) =>
        sb.Append("<dt>").Append(name).Append("</dt><dd>").Append(html).Append("</dd>\n");

    private static string H(string? s) => HtmlText.Escape(s);
}
