using Parity.Engine.Columns;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parquet;
using Parquet.Schema;

namespace Parity.Tests.Engine.IO;

public sealed class ModeConversionTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    private string Csv() => _files.Write("t.csv", "n,m,b,c,s,t\n1,1,true,true,x,2026-01-01T00:00:00Z\n2,,false,,,\n");

    // Spec §2.1: the type of each kind of data per mode.
    [Theory]
    [InlineData("boxed+nan+alias", "int64", "float64", "bool", "object", "object", "timestamp")]
    [InlineData("boxed+null+cow", "int64", "int64", "bool", "bool", "object", "timestamp")]
    [InlineData("arrow+nan+cow", "int64", "float64", "bool", "object", "utf8", "timestamp")]
    [InlineData("arrow+null+alias", "int64", "int64", "bool", "bool", "utf8", "timestamp")]
    public void Types_follow_the_mode(string mode, string n, string m, string b, string c, string s, string t)
    {
        var table = DataLoader.Load(Csv(), LoadOptions.Default, Mode.Parse(mode));
        Assert.Equal([n, m, b, c, s, t], table.Columns.Select(col => col.TypeLabel).ToArray());
    }

    [Fact]
    public void Int_with_missing_becomes_nan_float_under_nan_and_null_int_under_null()
    {
        var path = Csv();
        var legacy = DataLoader.Load(path, LoadOptions.Default, Mode.Legacy)["m"];
        Assert.True(double.IsNaN(((Float64Column)legacy).Span[1])); // Spec §2.1: missing becomes NaN
        Assert.Equal(MissingKind.NaN, legacy.GetValue(1).Missing);
        var modern = DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["m"];
        Assert.Equal(MissingKind.Null, modern.GetValue(1).Missing);
        Assert.Equal(1L, modern.GetValue(0).Int64);
    }

    [Fact]
    public void Bool_with_missing_is_boxed_bools_and_nan_under_nan()
    {
        var c = (ObjectColumn)DataLoader.Load(Csv(), LoadOptions.Default, Mode.Legacy)["c"];
        Assert.Equal(true, c.Cells.Span[0]);
        Assert.True(c.Cells.Span[1] is double d && double.IsNaN(d)); // Spec §2.1: object, missing is NaN
    }

    [Fact]
    public void Missing_timestamp_shows_nat_under_nan_and_null_under_null()
    {
        var path = Csv();
        Assert.Equal(MissingKind.NaT, DataLoader.Load(path, LoadOptions.Default, Mode.Legacy)["t"].GetValue(1).Missing);
        Assert.Equal(MissingKind.Null, DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["t"].GetValue(1).Missing);
    }

    // Spec §2.1 and §2.2: boxed+nan keeps None (a null read from a typed file) apart from NaN (nothing in a
    // CSV field); arrow+nan shows every missing string as NaN; null modes show null.
    [Theory]
    [InlineData("boxed+nan+alias", MissingKind.NaN, MissingKind.NoneRef)]
    [InlineData("arrow+nan+alias", MissingKind.NaN, MissingKind.NaN)]
    [InlineData("boxed+null+alias", MissingKind.Null, MissingKind.Null)]
    [InlineData("arrow+null+cow", MissingKind.Null, MissingKind.Null)]
    public void Missing_strings_by_source(string spelling, MissingKind fromCsv, MissingKind fromTypedFile)
    {
        var mode = Mode.Parse(spelling);
        var csv = _files.Write("s.csv", "s,k\nx,0\n,1\n\"\",2\n");
        Assert.Equal(fromCsv, DataLoader.Load(csv, LoadOptions.Default, mode)["s"].GetValue(1).Missing);

        var parquet = _files.PathOf("s.parquet");
        WriteParquetStrings(parquet, ["x", null]);
        Assert.Equal(fromTypedFile, DataLoader.Load(parquet, LoadOptions.Default, mode)["s"].GetValue(1).Missing);

        var arrow = _files.PathOf("s.arrow");
        var b = new Utf8ColumnBuilder(2, 8);
        b.Append("x");
        b.AppendMissing();
        ArrowIpcWriter.Write(new Parity.Engine.Frames.Table(["s"], [b.Build(MissingMarker.Null)], 2), arrow);
        Assert.Equal(fromTypedFile, DataLoader.Load(arrow, LoadOptions.Default, mode)["s"].GetValue(1).Missing);
    }

    [Fact]
    public void Loading_again_for_another_mode_shares_the_parsed_buffers()
    {
        var path = _files.Write("t.csv", "a\n1\n2\n");
        var x = (Int64Column)DataLoader.Load(path, LoadOptions.Default, Mode.Legacy)["a"];
        var y = (Int64Column)DataLoader.Load(path, LoadOptions.Default, Mode.Modern)["a"];
        Assert.NotSame(x, y);
        Assert.True(x.Values.Span == y.Values.Span); // one parse, two columns over the same buffer
    }

    internal static void WriteParquetStrings(string path, string?[] values)
    {
        var field = new DataField<string>("s", true);
        using var fs = File.Create(path);
        Task.Run(async () =>
        {
            await using var w = await ParquetWriter.CreateAsync(new ParquetSchema(field), fs);
            using var rg = w.CreateRowGroup();
            await rg.WriteAsync(field, values!);
        }).GetAwaiter().GetResult();
    }
}
