using System.Xml.Linq;
using Parity.Harness.Formatting;
using Parity.Harness.Reports;

namespace Parity.Tests.Reports;

public sealed class JUnitReportTests
{
    private static XDocument Parse(Parity.Harness.Findings.GateReport report) => XDocument.Parse(new JUnitReportWriter().Render(report));

    // Spec §5: JUnit XML, one test case per script and checkpoint. Structure as JUnit consumers read it
    // (testsuites/testsuite/testcase/failure; common practice, no source).
    [Fact]
    public void Has_a_suite_per_script_and_a_case_per_checkpoint_plus_statements()
    {
        var doc = Parse(ReportFixtures.Ordinary());
        var root = doc.Root!;
        Assert.Equal("testsuites", root.Name.LocalName);
        var suites = root.Elements("testsuite").ToList();
        Assert.Equal(["ferry/tickets.parity", "ferry/routes.parity"], suites.Select(s => (string)s.Attribute("name")!));
        var tickets = suites[0].Elements("testcase").ToList();
        Assert.Equal(["checkpoint adults", "checkpoint after refunds", "statements"], tickets.Select(t => (string)t.Attribute("name")!));
        Assert.All(tickets, t => Assert.Equal("ferry/tickets.parity", (string)t.Attribute("classname")!));

        // adults: a new type finding fails; the accepted missing finding is only reported.
        var adults = tickets[0];
        var failure = Assert.Single(adults.Elements("failure"));
        Assert.Equal("1 finding (1 type)", (string)failure.Attribute("message")!);
        Assert.Contains("column 'age' is float64 under legacy and int64 under modern", failure.Value, StringComparison.Ordinal);
        Assert.Contains("row 3: legacy NaN | modern null", adults.Element("system-out")!.Value, StringComparison.Ordinal);
        Assert.Empty(tickets[1].Elements("failure"));
        Assert.Single(tickets[2].Elements("failure")); // the alias finding belongs to a statement

        // Counts agree with the elements.
        foreach (var suite in suites)
        {
            Assert.Equal(suite.Elements("testcase").Count(), (int)suite.Attribute("tests")!);
            Assert.Equal(suite.Elements("testcase").Count(t => t.Element("failure") is not null), (int)suite.Attribute("failures")!);
        }
        Assert.Equal(5, (int)root.Attribute("tests")!);
        Assert.Equal(2, (int)root.Attribute("failures")!);
        Assert.Empty(suites[1].Descendants("failure")); // resolved findings do not fail
    }

    // XML 1.0 §2.2 (Characters) and §2.4 (markup escaped): the document parses and gives back the data.
    [Fact]
    public void Hostile_values_parse_back_as_data()
    {
        var doc = Parse(ReportFixtures.Hostile());
        var suite = Assert.Single(doc.Root!.Elements("testsuite"));
        var names = suite.Elements("testcase").Select(t => (string)t.Attribute("name")!).ToList();
        foreach (var value in ReportFixtures.HostileTexts)
            Assert.Contains("checkpoint " + CellText.Safe("notes " + value), names);
        Assert.Contains("checkpoint notes " + ReportFixtures.ScriptInjection, names);
        Assert.Equal("golden", names[^1]);
        Assert.Empty(doc.Descendants("script"));
        Assert.Empty(doc.Descendants("img"));
        var text = string.Concat(doc.Descendants("failure").Select(f => f.Value));
        foreach (var value in ReportFixtures.HostileTexts)
            Assert.Contains("message " + CellText.Safe(value), text, StringComparison.Ordinal);
        foreach (var c in text)
            Assert.False(c < ' ' && c != '\n', "control character in failure text");
    }

    // XML 1.0 §2.2: U+FFFE and U+FFFF are not characters XML can carry; they are replaced visibly.
    [Fact]
    public void Characters_xml_cannot_carry_are_replaced()
    {
        var report = ReportFixtures.Ordinary() with
        {
            Scripts = [ReportFixtures.Ordinary().Scripts[0] with { Script = "ferry/\uFFFEodd\uFFFF.parity" }],
        };
        var doc = Parse(report);
        Assert.Equal("ferry/\\u{FFFE}odd\\u{FFFF}.parity", (string)doc.Root!.Element("testsuite")!.Attribute("name")!);
    }

    [Fact]
    public void Changed_findings_and_golden_mismatches_fail()
    {
        var doc = Parse(ReportFixtures.Hostile());
        var golden = doc.Root!.Element("testsuite")!.Elements("testcase").Single(t => (string)t.Attribute("name")! == "golden");
        var failure = Assert.Single(golden.Elements("failure"));
        Assert.Equal("golden", (string)failure.Attribute("type")!);
        Assert.Equal("1 golden mismatch", (string)failure.Attribute("message")!);
        Assert.Contains("[changed]", doc.ToString(), StringComparison.Ordinal);
    }
}
