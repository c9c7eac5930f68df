using System.Globalization;
using System.Text;
using BenchmarkDotNet.Attributes;
using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parquet;
using Parquet.Schema;

namespace Parity.Benchmarks;

/// <summary>
/// Cold loads of one 20-column table (8 int64, 6 float64 with some missing, 2 bool, 1 timestamp and three
/// 20-character ASCII string columns) from CSV, Parquet and Arrow IPC into boxed and Arrow string storage.
/// The files are written once into a temp folder (kept, so <c>parity inspect</c> can be run on them).
/// </summary>
[MemoryDiagnoser]
public class LoadBench
{
    private string _path = "";

    [Params(200_000)]
    public int Rows { get; set; }

    [Params("csv", "parquet", "arrow")]
    public string Format { get; set; } = "csv";

    [Params("boxed", "arrow")]
    public string Storage { get; set; } = "boxed";

    [GlobalSetup]
    public void Setup()
    {
        var dir = DataDirectory(Rows);
        WriteData(dir, Rows);
        _path = Path.Combine(dir, "wide." + Format);
    }

    [Benchmark]
    public int Load()
    {
        DataLoader.ClearCache();
        var mode = Storage == "boxed" ? Mode.Legacy : Mode.Modern;
        return DataLoader.Load(_path, LoadOptions.Default, mode).RowCount;
    }

    public static string DataDirectory(int rows) => Path.Combine(Path.GetTempPath(), "parity-loadbench-" + rows.ToString(CultureInfo.InvariantCulture));

    /// <summary>Writes wide.csv, wide.parquet and wide.arrow (same data) unless they exist.</summary>
    public static void WriteData(string dir, int rows)
    {
        Directory.CreateDirectory(dir);
        var csv = Path.Combine(dir, "wide.csv");
        if (!File.Exists(csv)) WriteCsv(csv, rows);
        var arrow = Path.Combine(dir, "wide.arrow");
        var parquet = Path.Combine(dir, "wide.parquet");
        if (File.Exists(arrow) && File.Exists(parquet)) return;
        var table = DataLoader.Load(csv, LoadOptions.Default, Mode.Modern);
        if (!File.Exists(arrow)) ArrowIpcWriter.Write(table, arrow);
        if (!File.Exists(parquet)) WriteParquetAsync(table, parquet).GetAwaiter().GetResult();
    }

    private static void WriteCsv(string path, int rows)
    {
        var rng = new Random(42);
        using var w = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 16);
        var header = new List<string>();
        for (var i = 0; i < 8; i++) header.Add("i" + i.ToString(CultureInfo.InvariantCulture));
        for (var i = 0; i < 6; i++) header.Add("f" + i.ToString(CultureInfo.InvariantCulture));
        header.AddRange(["b0", "b1", "t0", "s0", "s1", "s2"]);
        w.Write(string.Join(',', header) + "\n");
        var sb = new StringBuilder(512);
        var chars = new char[20];
        var start = new DateTime(2026, 1, 1, 0, 0, 0, DateTimeKind.Utc);
        for (var r = 0; r < rows; r++)
        {
            sb.Clear();
            for (var i = 0; i < 8; i++) sb.Append(rng.NextInt64(-1_000_000, 1_000_000).ToString(CultureInfo.InvariantCulture)).Append(',');
            for (var i = 0; i < 6; i++)
            {
                if (rng.Next(50) != 0) sb.Append((rng.NextDouble() * 1000).ToString("R", CultureInfo.InvariantCulture));
                sb.Append(',');
            }
            sb.Append(rng.Next(2) == 0 ? "true," : "false,");
            sb.Append(rng.Next(3) == 0 ? "TRUE," : "False,");
            sb.Append(start.AddSeconds(rng.Next(0, 30_000_000)).ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture));
            for (var s = 0; s < 3; s++)
            {
                for (var k = 0; k < chars.Length; k++) chars[k] = (char)('a' + rng.Next(26));
                sb.Append(',').Append(chars);
            }
            sb.Append('\n');
            w.Write(sb);
        }
    }

    private static async Task WriteParquetAsync(Table table, string path)
    {
        var fields = new List<DataField>();
        foreach (var (name, column) in table.Names.Zip(table.Columns))
        {
            fields.Add(column.Type switch
            {
                ColumnType.Int64 => new DataField<long>(name),
                ColumnType.Float64 => new DataField<double?>(name),
                ColumnType.Bool => new DataField<bool>(name),
                ColumnType.Timestamp => new DateTimeDataField(name, DateTimeFormat.Timestamp, isAdjustedToUTC: true, unit: DateTimeTimeUnit.Micros),
                _ => new DataField<string>(name, false),
            });
        }
        var schema = new ParquetSchema(fields);
        await using var fs = File.Create(path);
        await using var writer = await ParquetWriter.CreateAsync(schema, fs);
        using var rg = writer.CreateRowGroup();
        for (var c = 0; c < table.ColumnCount; c++)
        {
            var column = table.Columns[c];
            var n = column.Length;
            switch (column)
            {
                case Int64Column ic:
                    await rg.WriteAsync<long>(fields[c], ic.Values);
                    break;
                case Float64Column fc:
                {
                    var values = new double?[n];
                    for (var i = 0; i < n; i++) values[i] = fc.IsMissing(i) ? null : fc.Span[i];
                    await rg.WriteAsync<double>(fields[c], values.AsMemory());
                    break;
                }
                case BoolColumn bc:
                    await rg.WriteAsync<bool>(fields[c], bc.Values);
                    break;
                case TimestampColumn tc:
                {
                    var values = new DateTime[n];
                    for (var i = 0; i < n; i++) values[i] = DateTime.UnixEpoch.AddTicks(tc.Span[i] * 10);
                    await rg.WriteAsync<DateTime>(fields[c], values.AsMemory());
                    break;
                }
                default:
                {
                    var values = new string[n];
                    for (var i = 0; i < n; i++) values[i] = column.GetValue(i).String;
                    await rg.WriteAsync(fields[c], values);
                    break;
                }
            }
        }
    }
}
