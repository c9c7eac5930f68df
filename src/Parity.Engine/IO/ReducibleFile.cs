using Parity.Engine.Errors;
using Parity.Engine.IO.Internal;
using Parity.Engine.Modes;
using Parquet;
using Parquet.Schema;
using Table = Parity.Engine.Frames.Table;

namespace Parity.Engine.IO;

/// <summary>
/// A data file read once whose rows and columns can be cut down and written back in its own format: the
/// building block of a reduced fixture (docs/workflow.md, "Shrinking a finding"). A subset is typed exactly
/// as the loader types a file holding only those rows: CSV columns are inferred afresh from their text;
/// Parquet and Arrow IPC columns keep the types their schema gives.
/// </summary>
public sealed class ReducibleFile
{
    private readonly CsvTextTable? _csv;
    private readonly SourceTable? _typed;
    private readonly char _delimiter;

    private ReducibleFile(string format, CsvTextTable? csv, SourceTable? typed, char delimiter)
    {
        Format = format;
        _csv = csv;
        _typed = typed;
        _delimiter = delimiter;
        var names = new List<string>();
        if (csv is not null) names.AddRange(csv.Names);
        else foreach (var c in typed!.Columns) names.Add(c.Name);
        ColumnNames = names;
    }

    /// <summary><c>csv</c>, <c>parquet</c> or <c>arrow</c>.</summary>
    public string Format { get; }

    public IReadOnlyList<string> ColumnNames { get; }

    public int RowCount => _csv?.RowCount ?? _typed!.RowCount;

    /// <summary>
    /// Reads <paramref name="path"/> as <paramref name="options"/> says (format, delimiter); missing-value
    /// tokens apply later, per <see cref="Select"/>, so one read serves loads with different tokens.
    /// </summary>
    public static ReducibleFile Read(string path, LoadOptions options)
    {
        var display = options.DisplayPath ?? path;
        var format = DataLoader.FormatOf(path, options) ?? throw LoadThrow.Format(display, "unknown file extension: expected .csv, .parquet, .arrow, .arrows, .ipc or .feather (or say: as csv)");
        // Through the file-access layer, as every load: a regular file, read through the checked handle.
        using var opened = Files.SafeFile.OpenRead(path, new Files.FileReadRules { Display = display, Root = options.Root });
        var full = opened.ReopenPath;
        return format switch
        {
            "csv" => new ReducibleFile(format, CsvTextTable.Read(full, display, options.Delimiter), null, options.Delimiter),
            "parquet" => new ReducibleFile(format, null, ParquetSourceReader.Read(full, display), options.Delimiter),
            _ => new ReducibleFile(format, null, ArrowSourceReader.Read(full, opened.Length, display), options.Delimiter),
        };
    }

    /// <summary>
    /// <paramref name="rows"/> (ascending row indexes) of the columns <paramref name="keep"/> marks, typed as
    /// the loader would type a file holding only them, with the missing tokens of <paramref name="options"/>.
    /// </summary>
    public ReducedTable Select(int[] rows, bool[] keep, LoadOptions options)
    {
        if (keep.Length != ColumnNames.Count) throw new ArgumentException("one flag per column is needed", nameof(keep));
        if (_csv is not null) return new ReducedTable(_csv.Select(rows, keep, options.MissingTokens));
        var columns = new List<SourceColumn>();
        for (var c = 0; c < keep.Length; c++)
            if (keep[c]) columns.Add(_typed!.Columns[c].Take(rows));
        return new ReducedTable(new SourceTable(columns, rows.Length));
    }

    /// <summary>Writes <paramref name="rows"/> of the kept columns to <paramref name="stream"/> in this file's format.</summary>
    public void Write(Stream stream, int[] rows, bool[] keep)
    {
        if (_csv is not null)
        {
            _csv.Write(stream, rows, keep, _delimiter);
            return;
        }
        var subset = Select(rows, keep, LoadOptions.Default);
        if (Format == "parquet") WriteParquet(stream, subset.Source);
        else ArrowIpcWriter.WriteTo(stream, subset.Source.ToTable(ArrowWriteMode));
    }

    // Arrow-native storage with null markers: every column keeps its Arrow type and a missing cell is an Arrow
    // null, so the file reads back as the same columns in every mode.
    private static readonly Mode ArrowWriteMode = Mode.Modern;

    // Optional Parquet fields throughout: a missing cell is a Parquet null (no definition level), which the
    // loader reads back as missing; a NaN double that is a value stays a value. Timestamps are UTC microseconds.
    private static void WriteParquet(Stream stream, SourceTable table)
    {
        var fields = new List<Field>();
        foreach (var column in table.Columns)
        {
            fields.Add(column switch
            {
                SourceInt64 => new DataField<long?>(column.Name),
                SourceFloat64 => new DataField<double?>(column.Name),
                SourceBool => new DataField<bool?>(column.Name),
                SourceTimestamp => new DateTimeDataField(column.Name, DateTimeFormat.Timestamp, isAdjustedToUTC: true, unit: DateTimeTimeUnit.Micros, isNullable: true),
                SourceStrings => new DataField<string>(column.Name, true),
                _ => throw new EngineException(ErrorCodes.Internal, $"column '{column.Name}' cannot be written as Parquet"),
            });
        }
        var schema = new ParquetSchema(fields);
        WriteAsync().AsTask().GetAwaiter().GetResult();

        async ValueTask WriteAsync()
        {
            await using var writer = await ParquetWriter.CreateAsync(schema, stream).ConfigureAwait(false);
            using var group = writer.CreateRowGroup();
            var rows = table.RowCount;
            for (var c = 0; c < table.Columns.Count; c++)
            {
                var field = (DataField)fields[c];
                var column = table.Columns[c].ToColumn(ArrowWriteMode);
                switch (table.Columns[c])
                {
                    case SourceInt64:
                    {
                        var values = new long?[rows];
                        for (var i = 0; i < rows; i++) values[i] = column.IsMissing(i) ? null : column.GetValue(i).Int64;
                        await group.WriteAsync<long>(field, values.AsMemory()).ConfigureAwait(false);
                        break;
                    }
                    case SourceFloat64:
                    {
                        var values = new double?[rows];
                        for (var i = 0; i < rows; i++) values[i] = column.IsMissing(i) ? null : column.GetValue(i).Float64;
                        await group.WriteAsync<double>(field, values.AsMemory()).ConfigureAwait(false);
                        break;
                    }
                    case SourceBool:
                    {
                        var values = new bool?[rows];
                        for (var i = 0; i < rows; i++) values[i] = column.IsMissing(i) ? null : column.GetValue(i).Bool;
                        await group.WriteAsync<bool>(field, values.AsMemory()).ConfigureAwait(false);
                        break;
                    }
                    case SourceTimestamp:
                    {
                        var values = new DateTime?[rows];
                        for (var i = 0; i < rows; i++)
                            values[i] = column.IsMissing(i) ? null : new DateTime(DateTime.UnixEpoch.Ticks + column.GetValue(i).TimestampMicros * 10, DateTimeKind.Utc);
                        await group.WriteAsync<DateTime>(field, values.AsMemory()).ConfigureAwait(false);
                        break;
                    }
                    default:
                    {
                        var values = new string?[rows];
                        for (var i = 0; i < rows; i++) values[i] = column.IsMissing(i) ? null : column.GetValue(i).String;
                        await group.WriteAsync(field, values!).ConfigureAwait(false);
                        break;
                    }
                }
            }
        }
    }
}
