using Apache.Arrow;
using Apache.Arrow.Ipc;
using Apache.Arrow.Types;
using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Values;
using Column = Parity.Engine.Columns.Column;
using Table = Parity.Engine.Frames.Table;

namespace Parity.Engine.IO;

/// <summary>
/// Writes a <see cref="Table"/> as an Arrow IPC file (one record batch), atomically: to a temporary file
/// beside the target, then renamed over it, so a reader never sees half a file (and a reader that has the
/// old file memory-mapped keeps its old bytes).
/// <list type="bullet">
/// <item>int64, float64, bool, timestamp (microseconds, UTC) and utf8 columns keep their Arrow type; a
/// missing cell is an Arrow null (a NaN sentinel under <c>nan</c> too).</item>
/// <item>Strings are written as utf8 whatever their storage.</item>
/// <item>An object column whose present cells are all of one kind is written as that type (strings: utf8,
/// with field metadata <c>parity.storage = object</c>). A mixed object column is written as utf8 text
/// (each cell's <c>text(x)</c> form) with field metadata <c>parity.object = mixed</c>; the cell kinds, and
/// <c>None</c> against NaN, are not kept.</item>
/// </list>
/// </summary>
public static class ArrowIpcWriter
{
    /// <summary>Metadata key on a field written from boxed (object) storage.</summary>
    public const string StorageKey = "parity.storage";

    /// <summary>Metadata key on a field written from a mixed object column as text.</summary>
    public const string ObjectKey = "parity.object";

    public static void Write(Table table, string path)
    {
        var full = Path.GetFullPath(path);
        var dir = Path.GetDirectoryName(full) ?? ".";
        Directory.CreateDirectory(dir);
        var temp = Path.Combine(dir, "." + Path.GetFileName(full) + "." + Guid.NewGuid().ToString("N") + ".tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                WriteTo(stream, table);
                stream.Flush(flushToDisk: true);
            }
            File.Move(temp, full, overwrite: true);
        }
        finally
        {
            if (File.Exists(temp)) File.Delete(temp);
        }
    }

    /// <summary>Writes the table as an Arrow IPC file to <paramref name="stream"/> (left open; not atomic by itself).</summary>
    public static void WriteTo(Stream stream, Table table)
    {
        var bounds = BatchBounds(table);
        var batch = ToRecordBatch(bounds.Count == 2 ? table : Slice(table, 0, bounds[1]));
        using var writer = new ArrowFileWriter(stream, batch.Schema, leaveOpen: true);
        writer.WriteRecordBatch(batch);
        for (var b = 1; b < bounds.Count - 1; b++)
            writer.WriteRecordBatch(ToRecordBatch(Slice(table, bounds[b], bounds[b + 1] - bounds[b])));
        writer.WriteEnd();
    }

    /// <summary>
    /// Most body bytes per record batch. A table below it is one batch (the loader maps it without copying);
    /// a larger one is split so that no message body nears 2 GiB, which Apache.Arrow cannot address as one buffer.
    /// </summary>
    private const long BatchBytes = 1L << 30;

    /// <summary>Rows between checks of the running batch size.</summary>
    private const int BlockRows = 1 << 16;

    /// <summary>
    /// Row boundaries of the batches (first 0, last the row count): blocks of rows are added to a batch while its
    /// estimated body stays within <see cref="BatchBytes"/>. String bytes are counted per block, so a file whose long
    /// strings sit together is split where they are.
    /// </summary>
    internal static List<int> BatchBounds(Table table, long budget = BatchBytes)
    {
        var bounds = new List<int> { 0 };
        long size = 0;
        for (var start = 0; start < table.RowCount; start += BlockRows)
        {
            var rows = Math.Min(BlockRows, table.RowCount - start);
            long block = 0;
            foreach (var column in table.Columns) block += EstimatedBytes(column, start, rows);
            if (size > 0 && size + block > budget)
            {
                bounds.Add(start);
                size = 0;
            }
            size += block;
        }
        bounds.Add(table.RowCount);
        return bounds;
    }

    /// <summary>An upper estimate of the Arrow bytes of rows [start, start + rows) of a column.</summary>
    private static long EstimatedBytes(Column column, int start, int rows)
    {
        switch (column)
        {
            case Utf8Column u:
                return 4L * rows + u.Offsets[start + rows] - u.Offsets[start] + rows / 8 + 1;
            case ObjectColumn o:
            {
                long bytes = 8L * rows;
                var cells = o.Cells.Span.Slice(start, rows);
                // Three UTF-8 bytes at most per UTF-16 unit; non-string cells are written as short text or numbers.
                foreach (var cell in cells) bytes += cell is string s ? 3L * s.Length : 32;
                return bytes;
            }
            default:
                return 8L * rows + rows / 8 + 1;
        }
    }

    private static Table Slice(Table table, int start, int rows)
    {
        var columns = new Column[table.ColumnCount];
        for (var c = 0; c < columns.Length; c++) columns[c] = table.Columns[c].Slice(start, rows);
        return new Table(table.Names, columns, rows);
    }

    /// <summary>The table as one Arrow record batch (the layout <see cref="Write"/> stores).</summary>
    public static RecordBatch ToRecordBatch(Table table)
    {
        var fields = new List<Field>(table.ColumnCount);
        var arrays = new List<IArrowArray>(table.ColumnCount);
        for (var i = 0; i < table.ColumnCount; i++)
        {
            var (array, metadata) = ToArray(table.Columns[i]);
            fields.Add(new Field(table.Names[i], array.Data.DataType, nullable: true, metadata));
            arrays.Add(array);
        }
        return new RecordBatch(new Schema(fields, null), arrays, table.RowCount);
    }

    private static (IArrowArray Array, IEnumerable<KeyValuePair<string, string>>? Metadata) ToArray(Column column)
    {
        var n = column.Length;
        switch (column)
        {
            case Int64Column or TimestampColumn:
            {
                var prim = (PrimitiveColumn<long>)column;
                var array = new PrimitiveData<long>(prim.Span, i => prim.Validity.IsValid(i));
                return column is TimestampColumn
                    ? (new TimestampArray(array.Build(new TimestampType(TimeUnit.Microsecond, "UTC"))), null)
                    : (new Int64Array(array.Build(Int64Type.Default)), null);
            }
            case Float64Column f:
                return (new DoubleArray(new PrimitiveData<double>(f.Span, i => !f.IsMissing(i)).Build(DoubleType.Default)), null);
            case BoolColumn b:
            {
                var builder = new BooleanArray.Builder().Reserve(n);
                for (var i = 0; i < n; i++)
                {
                    if (b.IsMissing(i)) builder.AppendNull();
                    else builder.Append(b.Span[i]);
                }
                return (builder.Build(), null);
            }
            case Utf8Column u:
            {
                var builder = new StringArray.Builder().Reserve(n);
                for (var i = 0; i < n; i++)
                {
                    if (u.IsMissing(i)) builder.AppendNull();
                    else builder.Append(u.GetBytes(i));
                }
                return (builder.Build(), null);
            }
            default:
                return ObjectToArray(column);
        }
    }

    private static (IArrowArray, IEnumerable<KeyValuePair<string, string>>?) ObjectToArray(Column column)
    {
        var n = column.Length;
        var values = ColumnFactory.ToValues(column);
        var kinds = new HashSet<ValueKind>();
        foreach (var v in values)
            if (!v.IsMissing) kinds.Add(v.Kind == ValueKind.Int64 && kinds.Contains(ValueKind.Float64) ? ValueKind.Float64 : v.Kind);
        if (kinds.Contains(ValueKind.Float64)) kinds.Remove(ValueKind.Int64);
        var note = new[] { new KeyValuePair<string, string>(StorageKey, "object") };
        if (kinds.Count == 1)
        {
            var only = kinds.First();
            var m = Mode(column);
            var typed = only switch
            {
                ValueKind.String => ColumnFactory.Build(values, ColumnType.Utf8, m),
                ValueKind.Int64 => ColumnFactory.Build(values, ColumnType.Int64, NullMode(m)),
                ValueKind.Float64 => ColumnFactory.Build(values, ColumnType.Float64, NullMode(m)),
                ValueKind.Bool => ColumnFactory.Build(values, ColumnType.Bool, NullMode(m)),
                _ => ColumnFactory.Build(values, ColumnType.Timestamp, NullMode(m)),
            };
            return (ToArray(typed).Array, note);
        }
        var builder = new StringArray.Builder().Reserve(n);
        foreach (var v in values)
        {
            if (v.IsMissing) builder.AppendNull();
            else builder.Append(ValueText.Format(v));
        }
        return (builder.Build(), [new KeyValuePair<string, string>(StorageKey, "object"), new KeyValuePair<string, string>(ObjectKey, "mixed")]);
    }

    private static Modes.Mode Mode(Column column) =>
        new(Modes.StringStorage.Arrow, column.Marker, Modes.WriteSemantics.Cow);

    // Typed rebuilds of object cells keep missing cells as nulls (a nan-mode int column would turn into float64).
    private static Modes.Mode NullMode(Modes.Mode m) => m with { Missing = Modes.MissingMarker.Null };

    /// <summary>A fixed-width Arrow array's buffers built from a span and a validity test.</summary>
    private readonly ref struct PrimitiveData<T>
        where T : unmanaged
    {
        private readonly ReadOnlySpan<T> _values;
        private readonly Func<int, bool> _valid;

        public PrimitiveData(ReadOnlySpan<T> values, Func<int, bool> valid)
        {
            _values = values;
            _valid = valid;
        }

        public ArrayData Build(IArrowType type)
        {
            var n = _values.Length;
            var bytes = System.Runtime.InteropServices.MemoryMarshal.AsBytes(_values).ToArray();
            var bits = new byte[(n + 7) >> 3];
            var nulls = 0;
            for (var i = 0; i < n; i++)
            {
                if (_valid(i)) bits[i >> 3] |= (byte)(1 << (i & 7));
                else nulls++;
            }
            var bitmap = nulls == 0 ? ArrowBuffer.Empty : new ArrowBuffer(bits);
            return new ArrayData(type, n, nulls, 0, [bitmap, new ArrowBuffer(bytes)]);
        }
    }
}
