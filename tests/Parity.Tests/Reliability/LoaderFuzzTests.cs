using System.Diagnostics;
using System.Text;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Harness.Fixtures;
using Parity.Tests.Engine.IO;
using Xunit.Abstractions;

namespace Parity.Tests.Reliability;

/// <summary>
/// Mutated and truncated CSV, Parquet and Arrow IPC bytes through <see cref="DataLoader.Load"/> in several
/// modes: each input ends in a table or a located <see cref="EngineException"/> (spec §6: "Every load reports
/// bad input with file, row and column"), never another exception, a hang or runaway allocation.
/// Fixed seeds; PARITY_FUZZ_SECONDS=N runs each fuzzer for N seconds instead.
/// </summary>
public sealed class LoaderFuzzTests(ITestOutputHelper output) : IDisposable
{
    private static readonly Mode[] Modes =
    [
        Mode.Legacy, Mode.Modern, Mode.Parse("arrow+nan+alias"), Mode.Parse("boxed+null+cow"),
    ];

    private static readonly byte[][] CsvTokens =
    [
        "\""u8.ToArray(), ","u8.ToArray(), ";"u8.ToArray(), "\n"u8.ToArray(), "\r\n"u8.ToArray(), "\r"u8.ToArray(),
        "\"\""u8.ToArray(), "\"a,\nb\""u8.ToArray(), [0xFF], [0xC3], [0xC0, 0x80], [0xED, 0xA0, 0x80], [0xF4, 0x90, 0x80, 0x80],
        [0xEF, 0xBB, 0xBF], [0x00], "1e400"u8.ToArray(), "-9223372036854775809"u8.ToArray(), "9223372036854775807"u8.ToArray(),
        "NaN"u8.ToArray(), "true"u8.ToArray(), "2026-02-30T25:61:00Z"u8.ToArray(), "\u001b[31m"u8.ToArray(), "🚢"u8.ToArray(),
    ];

    private static readonly byte[][] BinaryTokens = [[0], [0xFF, 0xFF, 0xFF, 0x7F], [0xFF, 0xFF, 0xFF, 0xFF], "PAR1"u8.ToArray(), "ARROW1"u8.ToArray(), [0x80]];

    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    [Fact]
    public void Mutated_csv_bytes_load_or_fail_with_a_located_error()
    {
        var seeds = CsvSeeds();
        var random = new Random(6021);
        var tally = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var clock = Stopwatch.StartNew();
        for (var n = 0; Fuzz.More(n, 700, clock); n++)
        {
            var seed = seeds[random.Next(seeds.Length)];
            var bytes = random.Next(20) == 0 ? HugeField(seed, random) : Fuzz.Mutate(seed, random, CsvTokens);
            var options = random.Next(4) switch
            {
                0 => LoadOptions.Default with { MissingTokens = ["", "n/a", "NaN"] },
                1 => LoadOptions.Default with { Delimiter = ';' },
                _ => LoadOptions.Default,
            };
            var mode = Modes[random.Next(Modes.Length)];
            Fuzz.Tally(tally, LoadOne("csv", n, bytes, options, mode, e => e.Code is ErrorCodes.CsvQuote or ErrorCodes.CsvRagged or ErrorCodes.Utf8));
        }
        output.WriteLine(Fuzz.Summary("csv", tally));
        Assert.True(tally.ContainsKey("ok"), "some mutations still load");
    }

    [Fact]
    public void Mutated_parquet_bytes_load_or_fail_with_a_located_error()
    {
        // The loader's backstop for a Parquet.Net open that never returns (default 30 s) must end before this
        // harness's own 20 s budget per input, or such an input would count as a hang, not as its E-PARQUET error.
        Environment.SetEnvironmentVariable("PARITY_PARQUET_OPEN_SECONDS", "5");
        var seeds = new List<byte[]> { File.ReadAllBytes(TestFiles.Fixture("harbor/sailings.parquet")) };
        var generated = _files.PathOf("seed.parquet");
        new HarborLineGenerator(3).WriteSailings(generated, 40);
        seeds.Add(File.ReadAllBytes(generated));
        RunBinary("parquet", seeds, 450, 7331);
    }

    [Fact]
    public void Mutated_arrow_ipc_bytes_load_or_fail_with_a_located_error()
    {
        var seeds = new List<byte[]> { File.ReadAllBytes(TestFiles.Fixture("harbor/routes.arrow")) };
        // A file written by our own writer from a loaded CSV: strings, ints with missing, floats, timestamps, bools.
        var table = DataLoader.Load(TestFiles.Fixture("harbor/tickets.csv"), LoadOptions.Default, Mode.Modern);
        var path = _files.PathOf("seed.arrow");
        ArrowIpcWriter.Write(Head(table, 25), path);
        seeds.Add(File.ReadAllBytes(path));
        var boxed = _files.PathOf("seed-boxed.arrow");
        ArrowIpcWriter.Write(Head(DataLoader.Load(TestFiles.Fixture("harbor/tickets.csv"), LoadOptions.Default, Mode.Legacy), 25), boxed);
        seeds.Add(File.ReadAllBytes(boxed));
        RunBinary("arrow", seeds, 450, 9113);
    }

    private void RunBinary(string extension, List<byte[]> seeds, int quickCount, int seed)
    {
        var random = new Random(seed);
        var tally = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var clock = Stopwatch.StartNew();
        for (var n = 0; Fuzz.More(n, quickCount, clock); n++)
        {
            var source = seeds[random.Next(seeds.Count)];
            var bytes = random.Next(4) == 0 ? source[..random.Next(source.Length)] : Fuzz.Mutate(source, random, BinaryTokens);
            Fuzz.Tally(tally, LoadOne(extension, n, bytes, LoadOptions.Default, Modes[random.Next(Modes.Length)], _ => false));
        }
        output.WriteLine(Fuzz.Summary(extension, tally));
        Assert.True(tally.ContainsKey("ok"), "some mutations still load");
        Assert.True(tally.Count > 1, "some mutations are rejected");
    }

    /// <summary>Loads one input and checks the result is a consistent table (every column has the row count).</summary>
    private string LoadOne(string extension, int n, byte[] bytes, LoadOptions options, Mode mode, Func<EngineException, bool> needsRow)
    {
        // A fresh name per input: the loader's cache is keyed by path, size and time.
        var path = _files.WriteBytes("in" + n.ToString(System.Globalization.CultureInfo.InvariantCulture) + "." + extension, bytes);
        string Describe()
        {
            var keep = Path.Combine(Path.GetTempPath(), "parity-fuzz-failure." + extension);
            File.WriteAllBytes(keep, bytes);
            return $"{extension} input #{n} in {mode.Name} (delimiter '{options.Delimiter}'), saved to {keep}";
        }
        var outcome = Fuzz.Outcome(() =>
        {
            try
            {
                var table = DataLoader.Load(path, options, mode);
                CheckTable(table, Describe);
                return "ok";
            }
            catch (EngineException e)
            {
                Assert.True(e.File is not null, "no file in: " + e.Format());
                if (needsRow(e)) Assert.True(e.Row > 0, "no row in: " + e.Format());
                throw;
            }
        }, Describe);
        File.Delete(path);
        return outcome;
    }

    private static void CheckTable(Table table, Func<string> describe)
    {
        Assert.Equal(table.Names.Count, table.Columns.Count);
        foreach (var c in table.Columns)
        {
            if (c.Length != table.RowCount) Assert.Fail("column length differs from the row count for " + describe());
            for (var i = 0; i < c.Length; i++) _ = c.IsMissing(i);
        }
    }

    private static Table Head(Table t, int rows)
    {
        var cols = new List<Parity.Engine.Columns.Column>();
        foreach (var c in t.Columns) cols.Add(c.Slice(0, rows));
        return new Table(t.Names, cols, rows);
    }

    private static byte[][] CsvSeeds()
    {
        var lines = File.ReadAllLines(TestFiles.Fixture("harbor/tickets.csv"), Encoding.UTF8);
        var head = string.Join("\n", lines.Take(30)) + "\n";
        return
        [
            Encoding.UTF8.GetBytes(head),
            "id,name,note\n1,\"Åsa, the \"\"captain\"\"\",\"two\nlines\"\n2,Νίκος,\n3,李,n/a\n"u8.ToArray(),
            "a;b;c\n1;2,5;x\n;;\n3;4;\"q;q\"\n"u8.ToArray(),
            "when,flag,x\n2026-01-01T00:00:00Z,true,1\n,false,\n2026-06-01T12:30:00.123456Z,,2.5\n"u8.ToArray(),
            "\uFEFFonly\n"u8.ToArray(),
        ];
    }

    /// <summary>A field of a few megabytes (quoted or not) spliced into a seed.</summary>
    private static byte[] HugeField(byte[] seed, Random random)
    {
        var size = random.Next(1 << 20, 4 << 20);
        var field = new byte[size];
        Array.Fill(field, (byte)'x');
        var at = Array.IndexOf(seed, (byte)'\n') + 1;
        var quoted = random.Next(2) == 0;
        return [.. seed[..at], .. (quoted ? "\""u8.ToArray() : []), .. field, .. (quoted ? "\""u8.ToArray() : []), .. seed[at..]];
    }
}
