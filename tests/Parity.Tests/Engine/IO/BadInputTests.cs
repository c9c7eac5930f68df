using System.Text;
using Parity.Engine.Errors;
using Parity.Engine.IO;
using Parity.Engine.Modes;

namespace Parity.Tests.Engine.IO;

/// <summary>Spec §6: every load reports bad input with file, row and column; nothing else escapes.</summary>
public sealed class BadInputTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    private static EngineException Fails(string path, LoadOptions? options = null) =>
        Assert.Throws<EngineException>(() => DataLoader.Load(path, options ?? LoadOptions.Default, Mode.Modern));

    // RFC 4180 §2 rules 5-7; row = line of the record, col = field number, both 1-based.
    [Theory]
    [InlineData("a,b\n1,\"open\n2,3\n", ErrorCodes.CsvQuote, 2, 2)]
    [InlineData("a,b\n1,x\"y\n", ErrorCodes.CsvQuote, 2, 2)]
    [InlineData("a,b\n\"x\"y,1\n", ErrorCodes.CsvQuote, 2, 1)]
    [InlineData("a,b\n1,2\n3\n", ErrorCodes.CsvRagged, 3, 2)]
    [InlineData("a,b\n1,2,3\n", ErrorCodes.CsvRagged, 2, 3)]
    [InlineData("a,b\n\"x\ny\",1\n1,2,3\n", ErrorCodes.CsvRagged, 4, 3)]
    [InlineData("a,b\r\n1,2\r\n\r\n3,\"4\r\n", ErrorCodes.CsvQuote, 4, 2)]
    [InlineData("a,a\n1,2\n", ErrorCodes.CsvHeader, 1, 2)]
    [InlineData("a,,c\n1,2,3\n", ErrorCodes.CsvHeader, 1, 2)]
    [InlineData("", ErrorCodes.CsvHeader, 1, 0)]
    [InlineData("\"a,b\n1,2\n", ErrorCodes.CsvQuote, 1, 1)]
    public void Csv_errors_are_located(string text, string code, int row, int col)
    {
        var path = _files.Write("bad.csv", text);
        var ex = Fails(path, LoadOptions.Default with { DisplayPath = "bad.csv" });
        Assert.Equal(code, ex.Code);
        Assert.Equal(row, ex.Row);
        Assert.Equal(col, ex.ColumnNumber);
        Assert.Equal("bad.csv", ex.File);
        Assert.StartsWith("bad.csv:" + row, ex.Format(), StringComparison.Ordinal);
    }

    // Unicode §3.9 (D92, well-formed UTF-8): 0xFF never appears; a lone continuation byte; a truncated sequence.
    [Theory]
    [InlineData(new byte[] { 0xFF }, 2, 2)]
    [InlineData(new byte[] { 0x80 }, 2, 2)]
    [InlineData(new byte[] { 0xE2, 0x82 }, 2, 2)]
    [InlineData(new byte[] { 0xED, 0xA0, 0x80 }, 2, 2)] // an encoded surrogate (CESU-8) is not UTF-8
    public void Invalid_utf8_is_located(byte[] bad, int row, int col)
    {
        var bytes = Encoding.UTF8.GetBytes("a,b\n1,").Concat(bad).Concat(Encoding.UTF8.GetBytes("\n2,3\n")).ToArray();
        var ex = Fails(_files.WriteBytes("bad.csv", bytes));
        Assert.Equal(ErrorCodes.Utf8, ex.Code);
        Assert.Equal(row, ex.Row);
        Assert.Equal(col, ex.ColumnNumber);
    }

    [Fact]
    public void Invalid_utf8_after_a_multiline_record_counts_its_lines()
    {
        var bytes = Encoding.UTF8.GetBytes("a,b\n\"x\ny\",1\n3,").Concat(new byte[] { 0xC3 }).Concat("\n"u8.ToArray()).ToArray();
        var ex = Fails(_files.WriteBytes("bad.csv", bytes));
        Assert.Equal(ErrorCodes.Utf8, ex.Code);
        Assert.Equal(4, ex.Row);
        Assert.Equal(2, ex.ColumnNumber);
    }

    [Theory]
    [InlineData("missing.csv")]
    [InlineData("missing.parquet")]
    [InlineData("missing.arrow")]
    [InlineData("no/such/dir/x.csv")]
    public void Missing_file(string name) => Assert.Equal(ErrorCodes.FileNotFound, Fails(_files.PathOf(name)).Code);

    [Fact]
    public void A_directory_is_refused_as_not_a_regular_file()
    {
        // docs/reliability.md, "Paths": only regular files are opened; anything else is E-PATH.
        var dir = Path.Combine(_files.Dir, "d.csv");
        Directory.CreateDirectory(dir);
        Assert.Equal(ErrorCodes.PathOutsideRoot, Fails(dir).Code);
    }

    [Fact]
    public void A_path_with_a_nul_is_unreadable() => Assert.Equal(ErrorCodes.FileRead, Fails(_files.Dir + "/a\0b.csv").Code);

    [Theory]
    [InlineData("data.txt", null)]
    [InlineData("data.csv", "xlsx")]
    public void Unknown_format(string name, string? format) =>
        Assert.Equal(ErrorCodes.FileFormat, Fails(_files.Write(name, "a\n1\n"), LoadOptions.Default with { Format = format }).Code);

    [Theory]
    [InlineData("x.parquet", ErrorCodes.Parquet)]
    [InlineData("x.arrow", ErrorCodes.ArrowIpc)]
    [InlineData("x.arrows", ErrorCodes.ArrowIpc)]
    public void Garbage_and_empty_typed_files(string name, string code)
    {
        Assert.Equal(code, Fails(_files.WriteBytes(name, Encoding.ASCII.GetBytes("this is not a binary table at all"))).Code);
        Assert.Equal(code, Fails(_files.WriteBytes("empty-" + name, [])).Code);
    }

    [Fact]
    public void Every_truncation_of_an_arrow_file_is_a_located_error_or_a_load()
    {
        var bytes = File.ReadAllBytes(TestFiles.Fixture("harbor/routes.arrow"));
        for (var cut = 0; cut < bytes.Length; cut += 7)
        {
            var path = _files.WriteBytes("cut" + cut + ".arrow", bytes[..cut]);
            AssertLoadsOrFailsCleanly(path, ErrorCodes.ArrowIpc);
        }
    }

    [Fact]
    public void Every_truncation_of_a_parquet_file_is_a_located_error()
    {
        var bytes = File.ReadAllBytes(TestFiles.Fixture("harbor/sailings.parquet"));
        for (var cut = 0; cut < bytes.Length; cut += 11)
        {
            var ex = Fails(_files.WriteBytes("cut" + cut + ".parquet", bytes[..cut]));
            Assert.Equal(ErrorCodes.Parquet, ex.Code);
        }
    }

    [Fact]
    public void Corrupted_bytes_never_escape_as_another_exception()
    {
        var rng = new Random(11);
        foreach (var name in new[] { "harbor/routes.arrow", "harbor/sailings.parquet" })
        {
            var original = File.ReadAllBytes(TestFiles.Fixture(name));
            for (var k = 0; k < 60; k++)
            {
                var bytes = (byte[])original.Clone();
                for (var j = 0; j < 4; j++) bytes[rng.Next(bytes.Length)] = (byte)rng.Next(256);
                var path = _files.WriteBytes("c" + k + Path.GetExtension(name), bytes);
                AssertLoadsOrFailsCleanly(path, null);
            }
        }
    }

    private static void AssertLoadsOrFailsCleanly(string path, string? code)
    {
        try
        {
            foreach (var mode in new[] { Mode.Legacy, Mode.Modern })
            {
                var t = DataLoader.Load(path, LoadOptions.Default, mode);
                for (var c = 0; c < t.ColumnCount; c++)
                    for (var r = 0; r < t.RowCount; r++) _ = t.Columns[c].GetValue(r);
            }
        }
        catch (EngineException ex)
        {
            if (code is not null && ex.Code != ErrorCodes.Utf8) Assert.Equal(code, ex.Code);
        }
    }
}
