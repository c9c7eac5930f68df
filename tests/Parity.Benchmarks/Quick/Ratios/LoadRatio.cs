using System.Globalization;
using Parity.Benchmarks.Data;
using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parquet;
using Parquet.Schema;

namespace Parity.Benchmarks.Quick.Ratios;

/// <summary>
/// A cold load (the loader's cache cleared first) of 5,000,000 rows of one string column (10-30 ASCII
/// bytes, 5% missing), into boxed storage over Arrow storage (both with the null marker, so only
/// the storage differs). Arrow IPC: the Arrow side wraps the mapped file; Parquet: the Arrow side copies raw
/// UTF-8 byte slices into one buffer, the boxed side also decodes every cell to a managed string.
/// The Arrow IPC file is written afresh by every run, so its pages sit in the OS page cache as they do after any
/// write (or a cold read): in large folios, which a mapping takes in a few faults. A file the OS has partly
/// evicted and faulted back in 4 KB pages maps about 10 ms slower (results/quick.md has both measurements).
/// </summary>
public sealed class LoadRatio : Ratio
{
    public const int Rows = 5_000_000;
    private static readonly Mode BoxedMode = Mode.Parse("boxed+null+cow");
    private static readonly Mode ArrowMode = Mode.Parse("arrow+null+cow");
    private readonly string _format;
    private readonly double _target;
    private string _path = "";

    public LoadRatio(string format, double target)
    {
        _format = format;
        _target = target;
    }

    public override string Name => "load_" + _format + ".boxed_over_arrow";

    public override double Target => _target;

    public override string Description => "boxed load ms / arrow load ms";

    public override int Repetitions => 5;

    public override void Setup() => _path = EnsureFile(_format, rewrite: _format == "ipc");

    public override void Verify()
    {
        var a = Load(BoxedMode);
        var b = Load(ArrowMode);
        if (a.RowCount != Rows || b.RowCount != Rows) throw new InvalidOperationException(Name + ": row count");
        for (var i = 0; i < Rows; i += 9973)
        {
            if (!a.Columns[0].GetValue(i).Equals(b.Columns[0].GetValue(i)))
                throw new InvalidOperationException($"{Name}: storages disagree at row {i}");
        }
    }

    public override void Numerator() => Load(BoxedMode);

    public override void Denominator() => Load(ArrowMode);

    private Table Load(Mode mode)
    {
        DataLoader.ClearCache();
        return DataLoader.Load(_path, LoadOptions.Default, mode);
    }

    /// <summary>Writes <c>name5m.ipc</c> / <c>name5m.parquet</c> into the temp folder once, or every time when asked.</summary>
    public static string EnsureFile(string format, bool rewrite = false)
    {
        var dir = Path.Combine(Path.GetTempPath(), "parity-quick-load");
        Directory.CreateDirectory(dir);
        var path = Path.Combine(dir, "name" + (Rows / 1_000_000).ToString(CultureInfo.InvariantCulture) + "m." + format);
        if (File.Exists(path) && !rewrite) return path;
        var strings = BenchData.Strings(Rows, 10, 30, 0.05, seed: 5);
        var tmp = path + ".tmp";
        if (format == "ipc")
        {
            var table = new Table(["name"], [BenchData.Arrow(strings, MissingMarker.Null)], Rows);
            ArrowIpcWriter.Write(table, tmp);
        }
        else
        {
            WriteParquetAsync(tmp, strings).GetAwaiter().GetResult();
        }
        File.Move(tmp, path, overwrite: true);
        return path;
    }

    private static async Task WriteParquetAsync(string path, string?[] strings)
    {
        var name = new DataField<string>("name", true);
        await using var fs = File.Create(path);
        await using var writer = await ParquetWriter.CreateAsync(new ParquetSchema(name), fs);
        // Row groups of 1,000,000 rows, as writers commonly use; Parquet.Net's default compression.
        for (var start = 0; start < strings.Length; start += 1_000_000)
        {
            var count = Math.Min(1_000_000, strings.Length - start);
            using var rg = writer.CreateRowGroup();
            await rg.WriteAsync(name, strings.AsMemory(start, count).ToArray());
        }
    }
}
