using System.Text.Json;
using Parity.Cli;
using Parity.Engine.IO;
using Parity.Tests.Engine.IO;

namespace Parity.Tests.Cli;

public sealed class InspectTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    private (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var code = CliApp.Run(args, new CliContext(output, error, _files.Dir));
        return (code, output.ToString(), error.ToString());
    }

    private const string Small = "id,name,age,ok\n1,Zoë,30,true\n2,,,false\n3,Ελένη,7,\n";

    [Fact]
    public void Json_has_the_spec_shape_and_values()
    {
        _files.Write("small.csv", Small);
        var (code, output, error) = Run("inspect", "small.csv", "--json");
        Assert.Equal(0, code);
        Assert.Equal("", error);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        // Spec §4: {"rows", "columns": [{"name", "types", "missing", "bytes": {"boxed", "arrow"}}], "bytes"}, in that order.
        Assert.Equal(["rows", "columns", "bytes"], root.EnumerateObject().Select(p => p.Name).ToArray());
        Assert.Equal(3, root.GetProperty("rows").GetInt32());
        var columns = root.GetProperty("columns").EnumerateArray().ToArray();
        Assert.Equal(new[] { "id", "name", "age", "ok" }, columns.Select(c => c.GetProperty("name").GetString() ?? "").ToArray());
        Assert.Equal(["name", "types", "missing", "bytes"], columns[0].EnumerateObject().Select(p => p.Name).ToArray());

        // Spec §4: types has legacy, modern and each of the 8 spellings.
        var keys = columns[0].GetProperty("types").EnumerateObject().Select(p => p.Name).ToArray();
        Assert.Equal(10, keys.Length);
        Assert.Equal(new[] { "legacy", "modern" }, keys[..2]);
        Assert.Equal(Parity.Engine.Modes.Mode.All.Select(m => m.Spelling).ToArray(), keys[2..]);

        // Spec §2.1 per mode.
        var age = columns[2].GetProperty("types");
        Assert.Equal("float64", age.GetProperty("legacy").GetString());
        Assert.Equal("int64", age.GetProperty("modern").GetString());
        Assert.Equal("float64", age.GetProperty("arrow+nan+cow").GetString());
        Assert.Equal("int64", age.GetProperty("boxed+null+alias").GetString());
        var name = columns[1].GetProperty("types");
        Assert.Equal("object", name.GetProperty("boxed+null+cow").GetString());
        Assert.Equal("utf8", name.GetProperty("arrow+nan+alias").GetString());
        var ok = columns[3].GetProperty("types");
        Assert.Equal("object", ok.GetProperty("legacy").GetString());
        Assert.Equal("bool", ok.GetProperty("modern").GetString());

        Assert.Equal([0, 1, 1, 1], columns.Select(c => c.GetProperty("missing").GetInt32()).ToArray());

        // Bytes by the formula of docs/data.md (Arrow buffers padded to 64; boxed objects on 64-bit .NET):
        // id: 3 int64 = 24 -> 64 both ways.
        // name boxed: 24 + 3*8 refs + "Zoë" 32 + "Ελένη" 32 + shared NaN 24 = 136;
        //      arrow: validity 64 + offsets 16->64 + 14 UTF-8 bytes -> 64 = 192.
        // age boxed: float64 with NaN, 64; arrow: int64 64 + validity 64 = 128.
        // ok boxed: 24 + 24 refs + true, false, NaN boxes 72 = 120; arrow: bits 64 + validity 64 = 128.
        Assert.Equal([64L, 136, 64, 120], columns.Select(c => c.GetProperty("bytes").GetProperty("boxed").GetInt64()).ToArray());
        Assert.Equal([64L, 192, 128, 128], columns.Select(c => c.GetProperty("bytes").GetProperty("arrow").GetInt64()).ToArray());
        Assert.Equal(384, root.GetProperty("bytes").GetProperty("boxed").GetInt64());
        Assert.Equal(512, root.GetProperty("bytes").GetProperty("arrow").GetInt64());
    }

    [Fact]
    public void Json_output_is_deterministic()
    {
        _files.Write("small.csv", Small);
        var first = Run("inspect", "small.csv", "--json").Out;
        DataLoader.ClearCache();
        Assert.Equal(first, Run("inspect", "small.csv", "--json").Out);
    }

    [Fact]
    public void Table_lists_every_column_aligned_with_totals()
    {
        _files.Write("small.csv", Small);
        var (code, output, _) = Run("inspect", "small.csv");
        Assert.Equal(0, code);
        var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("small.csv: 3 rows, 4 columns", lines[0]);
        Assert.StartsWith("column", lines[1], StringComparison.Ordinal);
        Assert.Contains("name    object   utf8", output, StringComparison.Ordinal);
        Assert.Matches(@"^total\s+3\s+384\s+512$", lines[^1]);
        // Right-aligned numbers: every data row ends at the same column as the header.
        Assert.All(lines[2..6], l => Assert.Equal(lines[1].Length, l.Length));
    }

    [Fact]
    public void Csv_options_match_the_script_load_options()
    {
        var output = new StringWriter();
        var code = CliApp.Run(["inspect", "raw_semicolon.csv", "--delimiter", ";", "--missing", "", "--missing", "n/a", "--json"],
            new CliContext(output, new StringWriter(), TestFiles.Fixture("data")));
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(output.ToString());
        var age = doc.RootElement.GetProperty("columns")[2];
        Assert.Equal("age", age.GetProperty("name").GetString());
        Assert.Equal(2, age.GetProperty("missing").GetInt32()); // 'n/a' and ''
        Assert.Equal("float64", age.GetProperty("types").GetProperty("legacy").GetString());
    }

    [Fact]
    public void A_long_delimiter_is_a_usage_error() => Assert.Equal(2, Run("inspect", "x.csv", "--delimiter", ";;").Code);

    [Fact]
    public void Control_characters_in_names_are_escaped()
    {
        _files.Write("ctl.csv", "\"a\u001b[31m\"\n1\n");
        var output = Run("inspect", "ctl.csv").Out;
        Assert.DoesNotContain("\u001b", output, StringComparison.Ordinal);
        Assert.Contains("a\\u001B[31m", output, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("bad.csv", "a,b\n1,\"x\n", "bad.csv:2:2: error E-CSV-QUOTE")]
    [InlineData("gone.csv", null, "gone.csv: error E-FILE-NOT-FOUND")]
    [InlineData("bad.arrow", "not arrow", "bad.arrow: error E-ARROW")]
    public void Bad_files_give_a_located_error_and_exit_2(string name, string? content, string expected)
    {
        if (content is not null) _files.Write(name, content);
        var (code, output, error) = Run("inspect", name);
        Assert.Equal(2, code);
        Assert.Equal("", output);
        Assert.StartsWith(expected, error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal); // no stack trace
    }

    [Fact]
    public void Harbor_fixtures_inspect_in_every_format()
    {
        foreach (var name in new[] { "tickets.csv", "sailings.parquet", "routes.arrow" })
        {
            var output = new StringWriter();
            var error = new StringWriter();
            var code = CliApp.Run(["inspect", name, "--json"], new CliContext(output, error, TestFiles.Fixture("harbor")));
            Assert.True(code == 0, error.ToString());
            using var doc = JsonDocument.Parse(output.ToString());
            Assert.True(doc.RootElement.GetProperty("rows").GetInt32() > 0);
        }
    }
}
