using Parity.Cli;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Tests.Engine.IO;

namespace Parity.Tests.Cli;

public sealed class FixturesTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    private int Run(params string[] args) => CliApp.Run(args, new CliContext(new StringWriter(), new StringWriter(), _files.Dir));

    [Fact]
    public void Same_seed_gives_the_same_bytes_and_the_files_load()
    {
        Assert.Equal(0, Run("fixtures", "--out", "a", "--rows", "120", "--seed", "3"));
        Assert.Equal(0, Run("fixtures", "--out", "b", "--rows", "120", "--seed", "3"));
        foreach (var name in new[] { "tickets.csv", "sailings.parquet", "routes.arrow" })
            Assert.Equal(File.ReadAllBytes(Path.Combine(_files.Dir, "a", name)), File.ReadAllBytes(Path.Combine(_files.Dir, "b", name)));
        Assert.Empty(Directory.GetFiles(Path.Combine(_files.Dir, "a"), "*.tmp")); // atomic writes leave no temp file

        var tickets = DataLoader.Load(Path.Combine(_files.Dir, "a", "tickets.csv"), LoadOptions.Default, Mode.Modern);
        Assert.Equal(120, tickets.RowCount);
        // Spec §7: missing ages and notes, refunds as negative fares, names in several scripts.
        Assert.Equal(["ticket_id", "sailing_id", "passenger", "age", "fare", "paid_at", "note", "is_child"], tickets.Names);
        Assert.Equal("timestamp", tickets["paid_at"].TypeLabel);
        Assert.True(tickets["age"].MissingCount > 0);
        Assert.True(tickets["note"].MissingCount > tickets.RowCount / 2);
        var legacy = DataLoader.Load(Path.Combine(_files.Dir, "a", "tickets.csv"), LoadOptions.Default, Mode.Legacy);
        Assert.Equal("float64", legacy["age"].TypeLabel);
        Assert.Equal("object", legacy["is_child"].TypeLabel);
        var routes = DataLoader.Load(Path.Combine(_files.Dir, "a", "routes.arrow"), LoadOptions.Default, Mode.Modern);
        Assert.Equal(["route_id", "name", "from_pier", "to_pier", "km"], routes.Names);
    }

    [Fact]
    public void Committed_set_is_what_the_generator_writes()
    {
        // docs/data.md: fixtures/harbor comes from --rows 400 --seed 7; regenerate it when the generator changes.
        Assert.Equal(0, Run("fixtures", "--out", "h", "--rows", "400", "--seed", "7"));
        foreach (var name in new[] { "tickets.csv", "sailings.parquet", "routes.arrow" })
            Assert.True(File.ReadAllBytes(TestFiles.Fixture("harbor/" + name)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(_files.Dir, "h", name))), name + " differs from the generator's output");
    }

    [Fact]
    public void Committed_tickets_hold_every_script_and_refunds()
    {
        var t = DataLoader.Load(TestFiles.Fixture("harbor/tickets.csv"), LoadOptions.Default, Mode.Modern);
        var names = Enumerable.Range(0, t.RowCount).Select(i => t["passenger"].GetValue(i).String).ToArray();
        Assert.Contains(names, n => n.Any(c => c is >= '\u0370' and <= '\u03FF')); // Greek block (Unicode)
        Assert.Contains(names, n => n.Any(c => c is >= '\u4E00' and <= '\u9FFF')); // CJK unified ideographs
        Assert.Contains(names, n => n.Any(char.IsSurrogate)); // emoji lie above U+FFFF
        Assert.Contains(names, n => n.Any(c => c is >= '\u00C0' and <= '\u017F')); // Latin with accents
        Assert.Contains(Enumerable.Range(0, t.RowCount), i => t["fare"].GetValue(i).Float64 < 0);
    }

    [Fact]
    public void Rows_below_one_is_a_usage_error()
    {
        var error = new StringWriter();
        var code = CliApp.Run(["fixtures", "--out", "x", "--rows", "0"], new CliContext(new StringWriter(), error, _files.Dir));
        Assert.Equal(2, code);
        Assert.Contains("E-USAGE", error.ToString(), StringComparison.Ordinal);
    }
}
