using Parity.Harness.Findings;

namespace Parity.Tests.Reports;

/// <summary>
/// Harbor Line reports for the writer tests: ordinary findings, and one script whose values try every
/// trick a report must survive (markup, table pipes, backticks, newlines, control characters, U+2028).
/// </summary>
internal static class ReportFixtures
{
    /// <summary>Sets document.title if it ever runs; the HTML test checks it never does.</summary>
    public const string ScriptInjection = "<script>document.title='pwned'</script>";

    public const string ImgInjection = "<img src=x onerror=\"document.title='pwned'\">";

    public const string Pipe = "fare | refund";

    public const string Backticks = "``` code `tick`";

    public const string Newline = "line one\nline two\r\n# heading";

    public const string Control = "bell\u0007esc\u001b[31mred\u0000nul";

    public const string LineSeparator = "para\u2028graph\u2029end";

    public const string Markdown = "*bold* _em_ [link](http://x) ![img](y) <b>tag</b> &amp; $math$ ~~s~~";

    /// <summary>Every hostile value, in a fixed order.</summary>
    public static IReadOnlyList<string> HostileTexts { get; } =
        [ScriptInjection, ImgInjection, Pipe, Backticks, Newline, Control, LineSeparator, Markdown];

    public static GateReport Ordinary(string command = "run") => new()
    {
        Command = command,
        Scripts =
        [
            new ScriptResult
            {
                Script = "ferry/tickets.parity",
                Modes = ["legacy", "modern"],
                Checkpoints =
                [
                    Checkpoint("adults", 4, ("passenger", "object", "utf8"), ("age", "float64", "int64")),
                    Checkpoint("after refunds", 9, ("passenger", "object", "utf8"), ("fare", "float64", "float64")),
                ],
                Findings =
                [
                    new Finding
                    {
                        Kind = FindingKind.Type, Script = "ferry/tickets.parity", Line = 4, Checkpoint = "adults", Column = "age", Count = 1,
                        Message = "column 'age' is float64 under legacy and int64 under modern",
                        Hint = "integers with missing values stay int64 with nulls under the new defaults",
                        Modes = ["legacy", "modern"],
                    },
                    new Finding
                    {
                        Kind = FindingKind.Missing, Script = "ferry/tickets.parity", Line = 4, Checkpoint = "adults", Column = "age", Count = 2,
                        Status = FindingStatus.Accepted, AcceptedCount = 2,
                        Message = "missing ages print NaN under legacy and null under modern",
                        Hint = "compare with 'is null' rather than text",
                        Modes = ["legacy", "modern"],
                        Samples = [new FindingSample(1, ["NaN", "null"]), new FindingSample(3, ["NaN", "null"])],
                    },
                    new Finding
                    {
                        Kind = FindingKind.Alias, Script = "ferry/tickets.parity", Line = 7, Count = 1,
                        Message = "the write reached 'tickets' under legacy only",
                        Hint = "write into the named frame instead of a temporary",
                        Modes = ["legacy", "modern"],
                        Samples = [new FindingSample(null, ["'cheap', 'tickets'", "'cheap'"])],
                    },
                ],
            },
            new ScriptResult
            {
                Script = "ferry/routes.parity",
                Modes = ["legacy", "modern"],
                Checkpoints = [Checkpoint("routes", 2, ("route", "object", "utf8"))],
                Findings =
                [
                    new Finding
                    {
                        Kind = FindingKind.Value, Script = "ferry/routes.parity", Line = 2, Checkpoint = "routes", Column = "route", Count = 1,
                        Status = FindingStatus.Resolved,
                        Message = "gone", Hint = "", Modes = ["legacy", "modern"],
                    },
                ],
            },
        ],
    };

    /// <summary>A failing report whose every text field and sample holds the hostile values.</summary>
    public static GateReport Hostile(string? generatedAt = null)
    {
        var findings = new List<Finding>();
        var i = 0;
        foreach (var value in HostileTexts)
        {
            i++;
            findings.Add(new Finding
            {
                Kind = i % 2 == 0 ? FindingKind.Value : FindingKind.Missing,
                Script = "ferry/hostile.parity",
                Line = 10 + i,
                Checkpoint = "notes " + value,
                Column = "note " + value,
                Count = i,
                Status = i % 3 == 0 ? FindingStatus.Changed : FindingStatus.New,
                AcceptedCount = i % 3 == 0 ? i + 1 : null,
                Message = "message " + value,
                Hint = "hint " + value,
                Modes = ["legacy", "modern"],
                Samples = [new FindingSample(i, ["'" + value + "'", "null"])],
            });
        }
        return new GateReport
        {
            Command = "check",
            GeneratedAt = generatedAt,
            Scripts =
            [
                new ScriptResult
                {
                    Script = "ferry/hostile.parity",
                    Modes = ["legacy", "modern"],
                    Checkpoints = [Checkpoint("notes " + ScriptInjection, 3, ("note " + Pipe, "object", "utf8"))],
                    Findings = findings,
                    GoldenMismatches =
                    [
                        new GoldenMismatch("ferry/hostile.parity", null, "modern", "accepted findings differ " + ScriptInjection,
                            "- 'a' " + Backticks + "\n+ 'b' " + Control)
                        {
                            Kind = GoldenMismatchKinds.Records,
                            Changes = [new GoldenChange(null, null, "write 'set t.x = 1' #1 " + Pipe, "'a' " + Backticks, "'b' " + Control)],
                        },
                        new GoldenMismatch("ferry/hostile.parity", "notes " + ScriptInjection, "legacy", "the frame differs", "")
                        {
                            RowsGolden = 2, RowsNow = 2, RowsChanged = 1, CellsChanged = 1,
                            Columns = [new KeyValuePair<string, long>("note " + Pipe, 1)],
                            Changes = [new GoldenChange(1, 1, "note " + Pipe, "'" + ScriptInjection + "'", "'" + Control + "'")],
                            GoldenColumns = ["id", "note " + Pipe],
                            NowColumns = ["id", "note " + Pipe],
                            Rows = [new GoldenRowChange(1, 1, ["2", "'" + ScriptInjection + "'"], ["2", "'" + Control + "'"], ["note " + Pipe])],
                        },
                    ],
                },
            ],
        };
    }

    private static CheckpointSummary Checkpoint(string label, int line, params (string Name, string Legacy, string Modern)[] columns)
    {
        var legacy = new List<ColumnShape>();
        var modern = new List<ColumnShape>();
        foreach (var (name, l, m) in columns)
        {
            legacy.Add(new ColumnShape(name, l));
            modern.Add(new ColumnShape(name, m));
        }
        return new CheckpointSummary(label, line, new Dictionary<string, CheckpointShape>(StringComparer.Ordinal)
        {
            ["legacy"] = new CheckpointShape(5, legacy),
            ["modern"] = new CheckpointShape(5, modern),
        });
    }
}
