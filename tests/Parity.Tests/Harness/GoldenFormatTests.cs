using System.Globalization;
using System.Text;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Harness.Findings;
using Parity.Harness.Golden;
using Parity.Script.Running;
using static Parity.Tests.Harness.HarnessFixtures;

namespace Parity.Tests.Harness;

public sealed class GoldenFormatTests
{
    private static readonly Mode L = Mode.Legacy;
    private static readonly Mode M = Mode.Modern;
    private static readonly long Sailing = ValueText.ToMicros(new DateTimeOffset(2026, 6, 1, 8, 30, 0, TimeSpan.Zero));

    /// <summary>Every kind of cell: NaN, None, null, NaT, non-finite float values, quotes, separators, control characters.</summary>
    private static Table Awkward(Mode mode)
    {
        var m = Missing(mode);
        return Table(mode,
            ("passenger", [S("Åsa | Lindqvist"), S("O'Brien"), mode.IsBoxed && mode.IsNan ? Value.NoneRef : m, S("a\nb\u001b[0m")]),
            ("fare", [F(12.5), F(-0.0), m, F(1e-7)]),
            ("ratio", [F(double.PositiveInfinity), F(double.NegativeInfinity), mode.IsNull ? F(double.NaN) : F(0.1), F(3.0)]),
            ("sailed", [Value.Timestamp(Sailing), mode.IsNan ? Value.NaT : Value.Null, Value.Timestamp(Sailing + 1), Value.Timestamp(-1)]),
            ("paid", [Value.Of(true), Value.Of(false), Value.Of(true), Value.Of(false)]),
            ("seats", [I(1), I(long.MinValue), I(long.MaxValue), I(0)]));
    }

    private static List<Value[]> Rows(Table t)
    {
        var rows = new List<Value[]>();
        for (var r = 0; r < t.RowCount; r++)
        {
            var row = new Value[t.ColumnCount];
            for (var c = 0; c < row.Length; c++) row[c] = t.Columns[c].GetValue(r);
            rows.Add(row);
        }
        return rows;
    }

    [Theory]
    [InlineData("legacy")]
    [InlineData("modern")]
    [InlineData("arrow+nan+alias")]
    [InlineData("boxed+null+cow")]
    public void Inline_frame_round_trips(string modeName)
    {
        var mode = Mode.Parse(modeName);
        var t = Awkward(mode);
        var text = GoldenFrameText.Write("after refunds", mode.Name, t, 1000, "x.arrow");
        var back = GoldenFrameText.Read(text, "f.txt");
        Assert.Equal("after refunds", back.Label);
        Assert.Equal(mode.Name, back.Mode);
        Assert.Equal(t.RowCount, back.Rows);
        Assert.Equal(t.Names, back.Columns.Select(c => c.Name));
        Assert.Equal(t.Columns.Select(c => c.TypeLabel), back.Columns.Select(c => c.Type));
        Assert.Equal(Rows(t), back.Data!);
        // One line per row, nothing else after the header: reads well in a line diff.
        Assert.Equal(t.RowCount, text.Split("data\n")[1].TrimEnd('\n').Split('\n').Length);
    }

    [Fact]
    public void Nan_none_and_null_are_told_apart_in_the_text()
    {
        // Spec §5: golden text tells NaN, a null reference (None) and null apart.
        var legacy = GoldenFrameText.Write("t", "legacy", Awkward(L), 1000, "x");
        var modern = GoldenFrameText.Write("t", "modern", Awkward(M), 1000, "x");
        Assert.Contains("| NaN |", legacy, StringComparison.Ordinal);
        Assert.Contains("\nNone |", legacy, StringComparison.Ordinal);
        Assert.Contains("| NaT |", legacy, StringComparison.Ordinal);
        Assert.Contains("| null |", modern, StringComparison.Ordinal);
        Assert.Contains("float:NaN", modern, StringComparison.Ordinal);
        Assert.Contains("float:Infinity", modern, StringComparison.Ordinal);
    }

    [Fact]
    public void Large_frame_keeps_a_summary_and_hash_and_the_data_in_arrow()
    {
        var mode = L;
        var n = 50;
        var t = Table(mode,
            ("id", Enumerable.Range(0, n).Select(i => I(i)).ToArray()),
            ("age", Enumerable.Range(0, n).Select(i => i % 7 == 0 ? Value.NaN : F(i)).ToArray()),
            ("note", Enumerable.Range(0, n).Select(i => i % 5 == 0 ? Value.NoneRef : i % 3 == 0 ? I(i) : S("n" + i.ToString(CultureInfo.InvariantCulture))).ToArray()),
            ("sailed", Enumerable.Range(0, n).Select(i => i % 9 == 0 ? Value.NaT : Value.Timestamp(Sailing + i)).ToArray()));
        var text = GoldenFrameText.Write("big", mode.Name, t, 10, "big.frame.arrow");
        var frame = GoldenFrameText.Read(text, "big.frame.txt");
        Assert.Null(frame.Data);
        Assert.Equal("big.frame.arrow", frame.ArrowFile);
        Assert.Equal(GoldenFrameText.ContentHash(t), frame.Sha256);
        Assert.Equal(5, frame.Preview.Count);
        Assert.Contains(frame.Missing, m => m.Column == "age" && m.Marker == "NaN" && m.Count == 8);
        Assert.Contains(frame.Missing, m => m.Column == "note" && m.Marker == "None" && m.Count == 10);
        var arrow = GoldenArrow.Write("big", mode, t);
        var back = GoldenArrow.Read(arrow, mode, "big.frame.arrow");
        Assert.Equal(Rows(t), Rows(back));
        Assert.Equal(t.Columns.Select(c => c.TypeLabel), back.Columns.Select(c => c.TypeLabel));
        Assert.Equal(frame.Sha256, GoldenFrameText.ContentHash(back));
    }

    [Theory]
    [InlineData("modern")]
    [InlineData("boxed+null+alias")]
    public void Arrow_file_keeps_null_modes_apart_from_nan_values(string modeName)
    {
        var mode = Mode.Parse(modeName);
        var t = Awkward(mode);
        var back = GoldenArrow.Read(GoldenArrow.Write("t", mode, t), mode, "t.arrow");
        Assert.Equal(Rows(t), Rows(back));
    }

    [Fact]
    public void Golden_text_is_byte_identical_across_cultures()
    {
        var run = Run(L, ("t", Awkward(L)));
        run.Writes.Add(new WriteRecord(3, 1, "tickets.fare", ["tickets", "İstanbul"]));
        string Render() => GoldenFrameText.Write("İı", "legacy", Awkward(L), 1000, "x") + GoldenFrameText.Write("big", "modern", Awkward(M), 2, "x")
            + GoldenRunText.Write(run);
        var saved = (CultureInfo.CurrentCulture, CultureInfo.CurrentUICulture);
        try
        {
            CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
            var expected = Render();
            foreach (var name in new[] { "en-US", "de-DE", "tr-TR", "ar-SA" })
            {
                CultureInfo.CurrentCulture = new CultureInfo(name);
                CultureInfo.CurrentUICulture = new CultureInfo(name);
                Assert.Equal(expected, Render());
            }
        }
        finally
        {
            (CultureInfo.CurrentCulture, CultureInfo.CurrentUICulture) = saved;
        }
    }

    [Fact]
    public void Golden_text_does_not_depend_on_the_local_time_zone()
    {
        // The TZ variable picks TimeZoneInfo.Local on Linux; rendering must not change with it.
        var before = Environment.GetEnvironmentVariable("TZ");
        try
        {
            Environment.SetEnvironmentVariable("TZ", "UTC");
            TimeZoneInfo.ClearCachedData();
            var utc = GoldenFrameText.Write("t", "legacy", Awkward(L), 1000, "x");
            Environment.SetEnvironmentVariable("TZ", "Pacific/Chatham");
            TimeZoneInfo.ClearCachedData();
            if (OperatingSystem.IsLinux()) Assert.NotEqual(TimeSpan.Zero, TimeZoneInfo.Local.BaseUtcOffset);
            Assert.Equal(utc, GoldenFrameText.Write("t", "legacy", Awkward(L), 1000, "x"));
            Assert.Contains("2026-06-01T08:30:00Z", utc, StringComparison.Ordinal);
        }
        finally
        {
            Environment.SetEnvironmentVariable("TZ", before);
            TimeZoneInfo.ClearCachedData();
        }
    }

    [Fact]
    public void Run_file_round_trips()
    {
        var run = Run(L, ("adults", Tickets(L)), ("after 'refunds'", Tickets(L)));
        run.Writes.Add(new WriteRecord(3, 1, "(tickets take 3).fare", ["tickets", "view"]));
        run.Writes.Add(new WriteRecord(4, 1, "adults.fare", []));
        run.Warnings.Add(new RunWarning("W-MAYBE-COPY", 4, 1, "write into a copy of 'tickets'", ["adults"]));
        run.Notes.Add(new RunNote(RunNote.NullCondition, 2, 25, 3, "3 rows dropped"));
        run.Failure = Error("E-CAST", "cannot cast 'age'", 9);
        var text = GoldenRunText.Write(run);
        var back = GoldenRunText.Read(text, "run.txt");
        Assert.Equal(["adults", "after 'refunds'"], back.Checkpoints);
        Assert.Equal(run.Writes.Select(w => (w.Line, w.Column, w.Target, string.Join(",", w.ChangedFrames))), back.Writes.Select(w => (w.Line, w.Column, w.Target, string.Join(",", w.ChangedFrames))));
        Assert.Equal("W-MAYBE-COPY", back.Warnings[0].Code);
        Assert.Equal(["adults"], back.Warnings[0].ReachedFrames);
        Assert.Equal(run.Notes[0], back.Notes[0]);
        Assert.Equal(new GoldenFailure("E-CAST", 9, 1, "cannot cast 'age'"), back.Failure);
    }

    [Fact]
    public void Findings_file_round_trips()
    {
        var accepted = new List<AcceptedFinding>
        {
            new("alias", 3, null, null, ["legacy", "modern"], 1, "the write changed {'tickets'}")
            {
                Statement = Parity.Script.Syntax.StatementKeys.Format("set (tickets take 3).fare = 0 where note = 'it''s'", 2),
                Difference = "changed {'tickets'} in legacy and {} in modern",
            },
            new("type", 10, "adults", "age", ["legacy", "modern"], 3, "type float64 in legacy") { Difference = "type float64 in legacy, int64 in modern", AlsoAt = ["later", "it's \n odd"] },
            new("missing", 10, "adults", "note | x", ["legacy", "boxed+null+cow"], 12, "NaN in legacy")
            {
                Difference = "a value in legacy where boxed+null+cow has null",
                CausedBy = "alias|ferry/refunds.parity|statement 'set t.fare = 1' #1|-|changed {} in legacy and {} in modern|legacy,modern",
            },
        };
        var text = GoldenFindingsText.Write("ferry/refunds.parity", accepted);
        var (script, back) = GoldenFindingsText.Read(text, "findings.txt");
        Assert.Equal("ferry/refunds.parity", script);
        Assert.Equal(accepted.Select(a => a.Identity + a.Count + a.Message + string.Join("/", a.AlsoAt) + a.CausedBy),
            back.Select(a => a.Identity + a.Count + a.Message + string.Join("/", a.AlsoAt) + a.CausedBy));
        // Keys carry no line numbers: the same findings at other lines have the same identity.
        Assert.Equal(accepted.Select(a => a.Identity), accepted.Select(a => (a with { Line = a.Line + 7 }).Identity));
    }

    [Fact]
    public void Findings_file_of_version_1_still_loads_with_line_identities()
    {
        var text = "# parity golden findings 1\nscript 'ferry/refunds.parity'\n"
            + "finding alias count 1 modes legacy,modern line 3 checkpoint - column -\n  message 'the write'\n"
            + "finding type count 1 modes legacy,modern line 10 checkpoint 'adults' column 'age'\n  message 'type float64'\n";
        var (_, back) = GoldenFindingsText.Read(text, "findings.txt");
        Assert.Equal(2, back.Count);
        Assert.All(back, a => Assert.Equal(1, a.Version));
        Assert.Equal(FindingIdentity.OfVersion1("alias", 3, null, null, ["legacy", "modern"]), back[0].Identity);
    }

    public static TheoryData<string, string, string> Corruptions() => new()
    {
        // (what, replace this, with this) on the inline frame text; expected "line:col" prefix computed in the test.
        { "cell", "| 12.5 |", "| 12,5 |" },
        { "quote", "'O''Brien'", "'O'Brien'" },
        { "type", "column 'fare' float64", "column 'fare' float32" },
        { "rows", "rows 4", "rows 5" },
        { "extra", "data\n", "data\n1 | 2 | 3 | 4 | 5 | 6\n" },
        { "magic", "# parity golden frame 1", "# parity golden frame 9" },
        { "separator", "'O''Brien' | ", "'O''Brien' ; " },
    };

    [Theory]
    [MemberData(nameof(Corruptions))]
    public void A_corrupted_frame_file_gives_a_located_error(string what, string from, string to)
    {
        var text = GoldenFrameText.Write("t", "legacy", Awkward(L), 1000, "x");
        Assert.Contains(from, text, StringComparison.Ordinal);
        var bad = text.Replace(from, to, StringComparison.Ordinal);
        var ex = Assert.Throws<EngineException>(() => GoldenFrameText.Read(bad, "golden/s/legacy/t.frame.txt"));
        Assert.Equal(ErrorCodes.Golden, ex.Code);
        Assert.True(ex.Row > 0 && ex.ColumnNumber > 0, what);
        Assert.StartsWith("golden/s/legacy/t.frame.txt:" + ex.Row.ToString(CultureInfo.InvariantCulture) + ":", ex.Format(), StringComparison.Ordinal);
        Assert.Contains(": error E-GOLDEN: ", ex.Format(), StringComparison.Ordinal);
    }

    [Fact]
    public void A_bad_cell_is_located_at_its_line_and_column()
    {
        var text = GoldenFrameText.Write("t", "legacy", Table(L, ("a", [I(1)]), ("b", [I(2)])), 1000, "x");
        var bad = text.Replace("1 | 2", "1 | 2x", StringComparison.Ordinal);
        var ex = Assert.Throws<EngineException>(() => GoldenFrameText.Read(bad, "f"));
        Assert.Equal(8, ex.Row);  // magic, label, mode, rows, 2 columns, data, then the row
        Assert.Equal(5, ex.ColumnNumber);
    }

    [Theory]
    [InlineData("write 3 'x' changed")]
    [InlineData("write 3:1 x changed")]
    [InlineData("nonsense")]
    [InlineData("note 2:1 null-condition many message 'x'")]
    public void A_corrupted_run_file_gives_a_located_error(string line)
    {
        var ex = Assert.Throws<EngineException>(() => GoldenRunText.Read(GoldenRunText.Magic + "\nmode legacy\n" + line + "\n", "run.txt"));
        Assert.Equal(3, ex.Row);
        Assert.Equal(ErrorCodes.Golden, ex.Code);
    }

    [Fact]
    public void A_corrupted_arrow_file_is_an_error_not_a_crash()
    {
        var bytes = GoldenArrow.Write("t", L, Awkward(L));
        var cut = bytes.AsSpan(0, bytes.Length / 2).ToArray();
        var ex = Assert.Throws<EngineException>(() => GoldenArrow.Read(cut, L, "t.frame.arrow"));
        Assert.Equal(ErrorCodes.Golden, ex.Code);
        Assert.StartsWith("t.frame.arrow: error E-GOLDEN", ex.Format(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("ferry/refunds.parity", "ferry~refunds")]
    [InlineData("refunds.parity", "refunds")]
    [InlineData("ferry/after refunds.parity", "ferry~after%20refunds")]
    [InlineData("../shared/x~y.parity", "%2E.~shared~x%7Ey")]
    [InlineData("Ωmega.parity", "%CE%A9mega")]
    public void Script_folder_names_are_portable_and_one_to_one(string script, string folder) =>
        Assert.Equal(folder, GoldenNames.ScriptFolder(script));

    [Fact]
    public void Utf8_without_bom_and_lf_line_endings()
    {
        var text = GoldenFrameText.Write("t", "legacy", Awkward(L), 1000, "x");
        Assert.DoesNotContain("\r", text, StringComparison.Ordinal);
        Assert.False(Encoding.UTF8.GetBytes(text).AsSpan().StartsWith(new byte[] { 0xEF, 0xBB, 0xBF }));
        Assert.EndsWith("\n", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Finding_identity_ignores_count_and_message()
    {
        var f = new Finding { Kind = FindingKind.Type, Script = "s", Line = 4, Checkpoint = "adults", Column = "age", Count = 3, Message = "a", Hint = "h", Modes = ["legacy", "modern"] };
        var a = GoldenFindingsText.FromFinding(f with { Count = 9, Message = "b" });
        Assert.Equal(FindingIdentity.Of(f), a.Identity);
    }
}
