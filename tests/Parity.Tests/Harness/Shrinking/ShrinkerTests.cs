using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Fixtures;
using Parity.Harness.Gate;
using Parity.Harness.Shrinking;
using Parity.Script.Parsing;
using Parity.Script.Running;

namespace Parity.Tests.Harness.Shrinking;

/// <summary>
/// <c>parity shrink</c> on constructed findings of each kind: the reduced fixture keeps the finding (checked by
/// loading the written files), is 1-minimal (checked independently: every one-row-smaller copy of the written
/// files, loaded from disk, loses it) and is the same bytes on a second run.
/// </summary>
public sealed class ShrinkerTests : IDisposable
{
    private const string Tickets = """
        id,passenger,age,fare,note,k
        1,Åsa,34,12.5,window,1
        2,Νίκος,,8.0,,
        3,李,71,-8.0,refund,3
        4,Zoë 🚢,17,4.25,,4
        5,Bo,,20.0,late,
        6,Cy,45,7.0,aisle,6
        7,Dé,52,3.5,"quoted, with comma",7
        8,Eli,,9.0,,8

        """;

    private const string Others = """
        k,route
        1,North
        ,South
        3,East
        ,West

        """;

    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-shrink-" + Guid.NewGuid().ToString("N"));

    public ShrinkerTests()
    {
        Directory.CreateDirectory(Path.Combine(_dir, "ferry"));
        File.WriteAllText(Path.Combine(_dir, "ferry", "t.csv"), Tickets);
        File.WriteAllText(Path.Combine(_dir, "ferry", "o.csv"), Others);
    }

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    public static TheoryData<string, string, string> Cases => new()
    {
        // Spec §2.2 (writes): a write through a `take` view reaches the parent under alias only.
        { "view-write", "load t from 't.csv'\nlet v = t take 3\nset v.fare = 0\ncheck t\n", "value|ferry/case.parity|checkpoint 't'|column 'fare'|values differ|legacy,modern" },
        // Spec §2.2: a row whose condition is null is dropped (and counted) under null; false under nan.
        { "null-condition", "load t from 't.csv'\nlet adults = t where age >= 18\ncheck adults\n", "missing|ferry/case.parity|statement 'let adults = t where age >= 18' #1|-|rows dropped because the condition was null|legacy,modern" },
        // Spec §2.2: text(x) of a missing value is the string 'nan' under boxed+nan only.
        { "nan-text", "load t from 't.csv'\nlet labels = t add age_text = text(age)\ncheck labels\n", "missing|ferry/case.parity|checkpoint 'labels'|column 'age_text'|the text 'nan' in legacy where modern has null|legacy,modern" },
        // Spec §2.2: a missing join key matches a missing key under nan and never under null.
        { "join-missing-keys", "load t from 't.csv'\nload o from 'o.csv'\nlet j = t join o on k\ncheck j\n", "shape|ferry/case.parity|checkpoint 'j'|-|row count|legacy,modern" },
        // Spec §2.2: a string predicate on a missing cell is missing under boxed+nan, so filtering by it is E-MASK-MISSING.
        { "mask-missing", "load t from 't.csv'\nlet n = t where contains(note, 'a')\ncheck n\n", "error|ferry/case.parity|statement 'let n = t where contains(note, ''a'')' #1|-|E-MASK-MISSING in legacy only|legacy,modern" },
        // Spec §2.1: integers with missing values are float64 under nan and int64 with nulls under null.
        { "type-change", "load t from 't.csv'\nload o from 'o.csv'\ncheck t\n", "type|ferry/case.parity|checkpoint 't'|column 'age'|type float64 in legacy, int64 in modern|legacy,modern" },
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void Keeps_the_finding_is_one_minimal_and_repeats_byte_for_byte(string name, string script, string key)
    {
        File.WriteAllText(Path.Combine(_dir, "ferry", "case.parity"), script);
        var first = Shrink(key, "out1-" + name);
        var second = Shrink(key, "out2-" + name);

        Assert.Equal(key, first.Finding.Key);
        Assert.False(first.StoppedByTimeLimit);
        Assert.True(first.OneMinimal);
        foreach (var f in first.Files) Assert.True(f.KeptRows.Count < f.RowsBefore, name + ": " + f.Source + " was not reduced");
        Assert.Equal(Snapshot(Path.GetDirectoryName(first.ScriptOut)!), Snapshot(Path.GetDirectoryName(second.ScriptOut)!));
        Assert.Equal(first.Attempts, second.Attempts);

        // Independent 1-minimality check through the ordinary loader: drop each data line of each written
        // file in turn; the finding must be gone every time.
        var outDir = Path.GetDirectoryName(first.ScriptOut)!;
        Assert.True(HasFinding(outDir, key));
        foreach (var file in first.Files)
        {
            var path = Path.Combine(outDir, file.Output);
            var lines = File.ReadAllLines(path);
            for (var i = 1; i < lines.Length; i++)
            {
                var fewer = new List<string>(lines);
                fewer.RemoveAt(i);
                var copy = CopyOut(outDir, "minimal-" + name + "-" + Path.GetFileNameWithoutExtension(file.Output) + "-" + i.ToString(System.Globalization.CultureInfo.InvariantCulture));
                File.WriteAllLines(Path.Combine(copy, file.Output), fewer);
                Assert.False(HasFinding(copy, key), $"{name}: {file.Output} without data line {i} still has the finding");
            }
        }
    }

    [Fact]
    public void Drops_the_columns_the_script_never_names_and_keeps_the_named_ones()
    {
        File.WriteAllText(Path.Combine(_dir, "ferry", "case.parity"), "load t from 't.csv'\nlet adults = t where age >= 18 select id, age\ncheck adults\n");
        var result = Shrink("missing|ferry/case.parity|statement 'let adults = t where age >= 18 select id, age' #1|-|rows dropped because the condition was null|legacy,modern", "cols");
        var tickets = Assert.Single(result.Files);
        Assert.Equal(["id", "age"], tickets.KeptColumns);
        // Spec §2.2: the dropped row is one whose age is missing (rows numbered from 0: ids 2, 5 and 8 have none).
        var row = Assert.Single(tickets.KeptRows);
        Assert.Contains(row, new[] { 1, 4, 7 });
    }

    [Fact]
    public void The_reduced_script_loads_its_data_relative_to_itself_and_runs_from_the_command_line()
    {
        File.WriteAllText(Path.Combine(_dir, "ferry", "case.parity"), "# a comment line\nload t from 't.csv'\nlet adults = t where age >= 18\ncheck adults\n");
        var o = new StringWriter();
        var e = new StringWriter();
        var exit = Parity.Cli.CliApp.Run(["shrink", "ferry/case.parity", "--finding", "missing|ferry/case.parity|statement 'let adults = t where age >= 18' #1|-|rows dropped because the condition was null|legacy,modern", "--out", "regress/adults"], new Parity.Cli.CliContext(o, e, _dir));
        Assert.Equal(0, exit);
        Assert.Equal("", e.ToString());
        Assert.Contains("1-minimal", o.ToString(), StringComparison.Ordinal);
        var text = File.ReadAllText(Path.Combine(_dir, "regress", "adults", "case.parity"));
        Assert.StartsWith("# a comment line\nload t from 'data/t.csv'\n", text, StringComparison.Ordinal);
        // The reduced script is an ordinary regression script: `run` finds the same finding in it.
        var o2 = new StringWriter();
        var run = Parity.Cli.CliApp.Run(["run", "regress/adults"], new Parity.Cli.CliContext(o2, new StringWriter(), _dir));
        Assert.Equal(1, run);
        Assert.Contains("rows dropped because the condition was null: 0 in legacy, 1 in modern", o2.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void An_unknown_key_is_bad_input_that_lists_the_keys()
    {
        File.WriteAllText(Path.Combine(_dir, "ferry", "case.parity"), "load t from 't.csv'\ncheck t\n");
        var e = new StringWriter();
        var exit = Parity.Cli.CliApp.Run(["shrink", "ferry/case.parity", "--finding", "value|nope"], new Parity.Cli.CliContext(new StringWriter(), e, _dir));
        Assert.Equal(2, exit);
        Assert.Contains("E-NO-FINDING", e.ToString(), StringComparison.Ordinal);
        Assert.Contains("type|ferry/case.parity|checkpoint 't'|column 'age'|type float64 in legacy, int64 in modern|legacy,modern", e.ToString(), StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(_dir, "shrink")));
    }

    [Fact]
    public void Refuses_to_write_over_the_script_or_its_data()
    {
        File.WriteAllText(Path.Combine(_dir, "ferry", "case.parity"), "load t from 't.csv'\ncheck t\n");
        var e = new StringWriter();
        var exit = Parity.Cli.CliApp.Run(["shrink", "ferry/case.parity", "--finding", "type|ferry/case.parity|checkpoint 't'|column 'age'|type float64 in legacy, int64 in modern|legacy,modern", "--out", "ferry"], new Parity.Cli.CliContext(new StringWriter(), e, _dir));
        Assert.Equal(2, exit);
        Assert.Contains("E-USAGE", e.ToString(), StringComparison.Ordinal);
        Assert.Equal("load t from 't.csv'\ncheck t\n", File.ReadAllText(Path.Combine(_dir, "ferry", "case.parity")));
    }

    [Fact]
    public void The_time_bound_stops_the_reduction_and_keeps_the_best_fixture_so_far()
    {
        File.WriteAllText(Path.Combine(_dir, "ferry", "case.parity"), "load t from 't.csv'\nlet adults = t where age >= 18\ncheck adults\n");
        // A clock that moves one second each time it is read: the bound of 6 seconds ends the reduction after
        // a few attempts, whatever the machine's speed.
        var result = Shrinker.Run(Request("missing|ferry/case.parity|statement 'let adults = t where age >= 18' #1|-|rows dropped because the condition was null|legacy,modern", "bounded") with { TimeLimit = TimeSpan.FromSeconds(6), Time = new SteppingClock() });
        Assert.True(result.StoppedByTimeLimit);
        Assert.False(result.OneMinimal);
        Assert.Equal("missing|ferry/case.parity|statement 'let adults = t where age >= 18' #1|-|rows dropped because the condition was null|legacy,modern", result.Finding.Key);
        Assert.True(HasFinding(Path.GetDirectoryName(result.ScriptOut)!, "missing|ferry/case.parity|statement 'let adults = t where age >= 18' #1|-|rows dropped because the condition was null|legacy,modern"));
        Assert.InRange(result.Attempts, 1, 5);
    }

    [Fact]
    public void Shrinks_the_harbor_line_demo_in_all_three_formats_within_its_bound()
    {
        // The 1M-row case is behind PARITY_SHRINK_LARGE=1 (minutes on a shared 2-core machine); 20,000 rows always run.
        var rows = Environment.GetEnvironmentVariable("PARITY_SHRINK_LARGE") == "1" ? 1_000_000 : 20_000;
        var data = Path.Combine(_dir, "harbor");
        new HarborLineGenerator(7).Write(data, rows);
        File.WriteAllText(Path.Combine(data, "trips.parity"), """
            load tickets from 'tickets.csv'
            load sailings from 'sailings.parquet'
            load routes from 'routes.arrow'
            let trips = tickets join sailings on sailing_id
            let adults = trips where age >= 18
            check adults
            """);
        const string Key = "missing|harbor/trips.parity|statement 'let adults = trips where age >= 18' #1|-|rows dropped because the condition was null|legacy,modern";
        var result = Shrinker.Run(new ShrinkRequest
        {
            ScriptPath = Path.Combine(data, "trips.parity"),
            FindingKey = Key,
            OutDirectory = Path.Combine(_dir, "harbor-out"),
            Options = new GateOptions { WorkingDirectory = _dir },
            TimeLimit = TimeSpan.FromSeconds(600),
        });
        Assert.Equal(Key, result.Finding.Key);
        Assert.True(HasFinding(Path.Combine(_dir, "harbor-out"), Key, "harbor/trips.parity"));
        Assert.Equal(["csv", "parquet", "arrow"], result.Files.Select(f => f.Format));
        Assert.True(File.Exists(Path.Combine(_dir, "harbor-out", "data", "sailings.parquet")));
        Assert.True(File.Exists(Path.Combine(_dir, "harbor-out", "data", "routes.arrow")));
        if (!result.StoppedByTimeLimit)
        {
            // One ticket with a missing age and its sailing; routes are not needed at all.
            Assert.Single(result.Files[0].KeptRows);
            Assert.Single(result.Files[1].KeptRows);
            Assert.Empty(result.Files[2].KeptRows);
        }
        Assert.True(result.Elapsed < TimeSpan.FromSeconds(600) || result.StoppedByTimeLimit);
    }

    private ShrinkResult Shrink(string key, string outName) => Shrinker.Run(Request(key, outName));

    private ShrinkRequest Request(string key, string outName) => new()
    {
        ScriptPath = Path.Combine(_dir, "ferry", "case.parity"),
        FindingKey = key,
        OutDirectory = Path.Combine(_dir, outName),
        Options = new GateOptions { WorkingDirectory = _dir },
    };

    /// <summary>Runs the reduced script from its files, under the original's name so keys compare.</summary>
    private static bool HasFinding(string outDir, string key, string shown = "ferry/case.parity")
    {
        var script = Directory.GetFiles(outDir, "*.parity").Single();
        var parsed = ScriptParser.Parse(File.ReadAllText(script), shown);
        Assert.False(parsed.HasErrors);
        var options = RunOptions.Default with { Root = outDir, KeepParsedSources = false };
        var runs = new[] { Interpreter.Run(parsed.Script, Mode.Legacy, outDir, options), Interpreter.Run(parsed.Script, Mode.Modern, outDir, options) };
        return ModeDiffer.CompareAll(runs, shown, DiffOptions.Default).Any(f => f.Key == key);
    }

    private string CopyOut(string outDir, string name)
    {
        var copy = Path.Combine(_dir, name);
        foreach (var file in Directory.GetFiles(outDir, "*", SearchOption.AllDirectories))
        {
            var target = Path.Combine(copy, Path.GetRelativePath(outDir, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target);
        }
        return copy;
    }

    private static SortedDictionary<string, string> Snapshot(string dir)
    {
        var result = new SortedDictionary<string, string>(StringComparer.Ordinal);
        foreach (var file in Directory.GetFiles(dir, "*", SearchOption.AllDirectories))
            result[Path.GetRelativePath(dir, file).Replace('\\', '/')] = Convert.ToHexString(File.ReadAllBytes(file));
        return result;
    }

    /// <summary>A clock that advances one second every time it is read.</summary>
    private sealed class SteppingClock : TimeProvider
    {
        private long _ticks;

        public override long TimestampFrequency => 1;

        public override long GetTimestamp() => ++_ticks;
    }
}
