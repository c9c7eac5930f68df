using Parity.Harness.Storage;
using System.Text;
using System.Xml;
using Parity.Harness.Findings;
using Parity.Harness.Reports.Internal;

namespace Parity.Harness.Reports;

/// <summary>
/// <c>junit.xml</c>: one <c>testsuite</c> per script; in it one <c>testcase</c> per checkpoint (named
/// <c>checkpoint LABEL</c>), one <c>statements</c> case for the findings that belong to a statement rather
/// than a checkpoint (writes, warnings, errors), and a <c>golden</c> case when a golden mismatch has no
/// checkpoint. A case fails (one <c>failure</c> element listing every failing finding) when it has a new or
/// changed finding or a golden mismatch; accepted and resolved findings go to <c>system-out</c>. Values are
/// made visible (control characters as <c>\n</c>, <c>\u{X}</c>) and characters XML 1.0 cannot carry are
/// replaced the same way; the XML writer escapes markup.
/// </summary>
public sealed class JUnitReportWriter : IReportWriter
{
    private const string StatementsCase = "statements";
    private const string GoldenCase = "golden";

    public string Format => "junit";

    public string FileName => "junit.xml";

    public void Write(GateReport report, string outDir) => AtomicFile.WriteAllText(Path.Combine(outDir, FileName), Render(report));

    public string Render(GateReport report)
    {
        var scripts = new List<(ScriptResult Script, List<TestCase> Cases)>();
        int tests = 0, failures = 0;
        foreach (var script in report.Scripts)
        {
            var cases = BuildCases(script);
            scripts.Add((script, cases));
            tests += cases.Count;
            foreach (var c in cases)
                if (c.Failing.Count > 0) failures++;
        }

        using var stream = new MemoryStream();
        var settings = new XmlWriterSettings
        {
            Encoding = new UTF8Encoding(encoderShouldEmitUTF8Identifier: false),
            Indent = true,
            IndentChars = "  ",
            NewLineChars = "\n",
            NewLineHandling = NewLineHandling.Replace,
        };
        using (var x = XmlWriter.Create(stream, settings))
        {
            x.WriteStartDocument();
            x.WriteStartElement("testsuites");
            x.WriteAttributeString("name", "parity " + X(report.Command));
            x.WriteAttributeString("tests", ReportFacts.Int(tests));
            x.WriteAttributeString("failures", ReportFacts.Int(failures));
            x.WriteAttributeString("errors", "0");
            if (report.GeneratedAt is not null) x.WriteAttributeString("timestamp", X(report.GeneratedAt));
            foreach (var (script, cases) in scripts)
                WriteSuite(x, script, cases);
            x.WriteEndElement();
            x.WriteEndDocument();
        }
        return Encoding.UTF8.GetString(stream.ToArray()) + "\n";
    }

    private static void WriteSuite(XmlWriter x, ScriptResult script, List<TestCase> cases)
    {
        var failing = 0;
        foreach (var c in cases)
            if (c.Failing.Count > 0) failing++;
        x.WriteStartElement("testsuite");
        x.WriteAttributeString("name", X(SafeText.Visible(script.Script)));
        x.WriteAttributeString("tests", ReportFacts.Int(cases.Count));
        x.WriteAttributeString("failures", ReportFacts.Int(failing));
        x.WriteAttributeString("errors", "0");
        x.WriteAttributeString("skipped", "0");
        x.WriteStartElement("properties");
        x.WriteStartElement("property");
        x.WriteAttributeString("name", "modes");
        x.WriteAttributeString("value", X(SafeText.Visible(string.Join(",", script.Modes))));
        x.WriteEndElement();
        x.WriteEndElement();
        foreach (var c in cases)
        {
            x.WriteStartElement("testcase");
            x.WriteAttributeString("classname", X(SafeText.Visible(script.Script)));
            x.WriteAttributeString("name", X(c.Name));
            if (c.Failing.Count > 0)
            {
                x.WriteStartElement("failure");
                x.WriteAttributeString("message", X(FailureMessage(c)));
                x.WriteAttributeString("type", c.Failing.Count == c.Mismatches.Count ? "golden" : FirstKind(c));
                x.WriteString(X(FailureText(c)));
                x.WriteEndElement();
            }
            if (c.Passing.Count > 0)
            {
                var sb = new StringBuilder();
                foreach (var f in c.Passing)
                    AppendFinding(sb, f);
                x.WriteElementString("system-out", X(sb.ToString()));
            }
            x.WriteEndElement();
        }
        x.WriteEndElement();
    }

    private static List<TestCase> BuildCases(ScriptResult script)
    {
        var cases = new List<TestCase>();
        var byLabel = new Dictionary<string, TestCase>(StringComparer.Ordinal);
        foreach (var cp in script.Checkpoints)
        {
            if (byLabel.ContainsKey(cp.Label)) continue;
            var tc = new TestCase("checkpoint " + SafeText.Visible(cp.Label));
            byLabel.Add(cp.Label, tc);
            cases.Add(tc);
        }
        var statements = new TestCase(StatementsCase);
        cases.Add(statements);
        TestCase? golden = null;

        foreach (var f in script.Findings)
        {
            var tc = statements;
            if (f.Checkpoint is not null && !byLabel.TryGetValue(f.Checkpoint, out tc))
            {
                // A finding at a checkpoint the summary does not list (a mode never reached it): its own case.
                tc = new TestCase("checkpoint " + SafeText.Visible(f.Checkpoint));
                byLabel.Add(f.Checkpoint, tc);
                cases.Insert(cases.IndexOf(statements), tc);
            }
            if (f.Status is FindingStatus.New or FindingStatus.Changed) tc.Failing.Add(f);
            else tc.Passing.Add(f);
        }
        foreach (var m in script.GoldenMismatches)
        {
            TestCase? tc = null;
            if (m.Checkpoint is null || !byLabel.TryGetValue(m.Checkpoint, out tc))
            {
                golden ??= new TestCase(GoldenCase);
                tc = golden;
            }
            tc.Mismatches.Add(m);
            tc.Failing.Add(m);
        }
        if (golden is not null) cases.Add(golden);
        return cases;
    }

    private static string FailureMessage(TestCase c)
    {
        var counts = new int[ReportFacts.Kinds.Count];
        foreach (var o in c.Failing)
            if (o is Finding f) counts[(int)f.Kind]++;
        var findings = c.Failing.Count - c.Mismatches.Count;
        var parts = new List<string>();
        if (findings > 0) parts.Add(ReportFacts.Int(findings) + (findings == 1 ? " finding (" : " findings (") + ReportFacts.KindSummary(counts) + ")");
        if (c.Mismatches.Count > 0) parts.Add(ReportFacts.Int(c.Mismatches.Count) + (c.Mismatches.Count == 1 ? " golden mismatch" : " golden mismatches"));
        return string.Join(", ", parts);
    }

    private static string FirstKind(TestCase c)
    {
        foreach (var o in c.Failing)
            if (o is Finding f) return f.KindLabel;
        return "golden";
    }

    private static string FailureText(TestCase c)
    {
        var sb = new StringBuilder();
        foreach (var o in c.Failing)
        {
            if (o is Finding f) AppendFinding(sb, f);
            else if (o is GoldenMismatch m)
            {
                sb.Append("golden mismatch (").Append(SafeText.Visible(m.Kind)).Append("), mode ").Append(SafeText.Visible(m.Mode)).Append(": ").Append(SafeText.Visible(GoldenDiffText.Summary(m))).Append('\n');
                foreach (var line in GoldenDiffText.Lines(m, GoldenDiffText.DefaultMaxRows))
                    sb.Append("  ").Append(SafeText.Visible(line)).Append('\n');
            }
        }
        return sb.ToString();
    }

    private static void AppendFinding(StringBuilder sb, Finding f)
    {
        sb.Append(f.KindLabel).Append(" at ").Append(SafeText.Visible(ReportFacts.Where(f)));
        if (f.Column is not null) sb.Append(", column '").Append(SafeText.Visible(f.Column)).Append('\'');
        sb.Append(": ").Append(ReportFacts.Int(f.Count)).Append(f.Count == 1 ? " row" : " rows")
            .Append(" [").Append(ReportFacts.Label(f.Status)).Append("]\n");
        sb.Append("  ").Append(SafeText.Visible(f.Message)).Append('\n');
        if (f.AlsoAt.Count > 0) sb.Append("  also at ").Append(SafeText.Visible(ReportFacts.AlsoAtText(f))).Append('\n');
        if (f.Hint.Length > 0) sb.Append("  hint: ").Append(SafeText.Visible(f.Hint)).Append('\n');
        foreach (var sample in f.Samples)
        {
            sb.Append("  row ").Append(sample.Row is { } r ? ReportFacts.Int(r) : "-").Append(':');
            for (var i = 0; i < f.Modes.Count; i++)
                sb.Append(i == 0 ? " " : " | ").Append(SafeText.Visible(f.Modes[i])).Append(' ').Append(SafeText.Visible(ReportFacts.SampleValue(sample, i)));
            sb.Append('\n');
        }
    }

    private static string X(string? s) => XmlChars.Clean(s);

    private sealed class TestCase(string name)
    {
        public string Name { get; } = name;

        /// <summary>New or changed findings and golden mismatches, in report order.</summary>
        public List<object> Failing { get; } = [];

        public List<GoldenMismatch> Mismatches { get; } = [];

        public List<Finding> Passing { get; } = [];
    }
}
