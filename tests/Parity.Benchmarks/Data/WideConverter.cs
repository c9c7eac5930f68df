using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parquet;
using Parquet.Schema;

namespace Parity.Benchmarks.Data;

/// <summary>
/// <c>convert FILE.csv</c>: writes FILE.arrow (our Arrow IPC writer) and FILE.parquet (Parquet.Net, row groups
/// of a million rows) with the same columns, for the large-input measurements of docs/reliability.md.
/// </summary>
internal static class WideConverter
{
    private const int RowGroup = 1_000_000;

    public static int Run(string csv)
    {
        var table = DataLoader.Load(csv, LoadOptions.Default, Mode.Modern);
        ArrowIpcWriter.Write(table, Path.ChangeExtension(csv, ".arrow"));
        WriteParquetAsync(table, Path.ChangeExtension(csv, ".parquet")).AsTask().GetAwaiter().GetResult();
        return 0;
    }

    private static async ValueTask WriteParquetAsync(Table table, string path)
    {
        var fields = new DataField[table.ColumnCount];
        for (var c = 0; c < fields.Length; c++)
        {
            var name = table.Names[c];
            fields[c] = table.Columns[c].Type switch
            {
                ColumnType.Int64 => new DataField<long?>(name),
                ColumnType.Float64 => new DataField<double?>(name),
                ColumnType.Bool => new DataField<bool?>(name),
                ColumnType.Timestamp => new DateTimeDataField(name, DateTimeFormat.Timestamp, isAdjustedToUTC: true, unit: DateTimeTimeUnit.Micros, isNullable: true),
                _ => new DataField<string>(name, true),
            };
        }
        await using var stream = File.Create(path);
        await using var writer = await ParquetWriter.CreateAsync(new ParquetSchema(fields), stream).ConfigureAwait(false);
        for (var start = 0; start < table.RowCount; start += RowGroup)
        {
            var n = Math.Min(RowGroup, table.RowCount - start);
            using var rg = writer.CreateRowGroup();
            for (var c = 0; c < fields.Length; c++)
            {
                var col = table.Columns[c];
                switch (col.Type)
                {
                    case ColumnType.Int64:
                    {
                        var v = new long?[n];
                        for (var i = 0; i < n; i++) v[i] = col.IsMissing(start + i) ? null : col.GetValue(start + i).Int64;
                        await rg.WriteAsync<long>(fields[c], v.AsMemory()).ConfigureAwait(false);
                        break;
                    }
                    case ColumnType.Float64:
                    {
                        var v = new double?[n];
                        for (var i = 0; i < n; i++) v[i] = col.IsMissing(start + i) ? null : col.GetValue(start + i).Float64;
                        await rg.WriteAsync<double>(fields[c], v.AsMemory()).ConfigureAwait(false);
                        break;
                    }
                    case ColumnType.Bool:
                    {
                        var v = new bool?[n];
                        for (var i = 0; i < n; i++) v[i] = col.IsMissing(start + i) ? null : col.GetValue(start + i).Bool;
                        await rg.WriteAsync<bool>(fields[c], v.AsMemory()).ConfigureAwait(false);
                        break;
                    }
                    case ColumnType.Timestamp:
                    {
                        var v = new DateTime?[n];
                        for (var i = 0; i < n; i++)
                            v[i] = col.IsMissing(start + i) ? null : DateTime.UnixEpoch.AddTicks(col.GetValue(start + i).TimestampMicros * 10);
                        await rg.WriteAsync<DateTime>(fields[c], v.AsMemory()).ConfigureAwait(false);
                        break;
                    }
                    default:
                    {
                        var v = new string?[n];
                        for (var i = 0; i < n; i++) v[i] = col.IsMissing(start + i) ? null : col.GetValue(start + i).String;
                        await rg.WriteAsync(fields[c], v!).ConfigureAwait(false);
                        break;
                    }
                }
            }
        }
    }
}
