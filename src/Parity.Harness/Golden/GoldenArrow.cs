using Apache.Arrow;
using Apache.Arrow.Ipc;
using Apache.Arrow.Types;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Harness.Formatting;
using Column = Parity.Engine.Columns.Column;
using Table = Parity.Engine.Frames.Table;

namespace Parity.Harness.Golden;

/// <summary>
/// The full data of a large golden frame as one Arrow IPC file (Apache Arrow columnar format, "IPC File
/// Format"), written with Apache.Arrow's <see cref="ArrowFileWriter"/> in one record batch. Each field
/// carries its type label in metadata <c>parity.type</c>; the schema carries <c>parity.mode</c> and
/// <c>parity.label</c>. int64, float64, bool and timestamp (microseconds, UTC) columns keep their Arrow
/// types and validity; a float64 column under <c>nan</c> keeps its NaN sentinels as values; utf8 columns are
/// Arrow strings; object columns are Arrow strings holding each cell's <see cref="CellText"/> form, so
/// NaN, None and the value kinds of a mixed column survive.
/// </summary>
public static class GoldenArrow
{
    public const string TypeKey = "parity.type";
    public const string ModeKey = "parity.mode";
    public const string LabelKey = "parity.label";

    public static byte[] Write(string label, Mode mode, Table table)
    {
        var schema = new Schema.Builder().Metadata(ModeKey, mode.Name).Metadata(LabelKey, label);
        var arrays = new IArrowArray[table.ColumnCount];
        for (var c = 0; c < table.ColumnCount; c++)
        {
            var col = table.Columns[c];
            arrays[c] = ToArrow(col);
            schema.Field(new Field.Builder().Name(table.Names[c]).DataType(arrays[c].Data.DataType).Nullable(true).Metadata(TypeKey, col.TypeLabel).Build());
        }
        var built = schema.Build();
        using var ms = new MemoryStream();
        using (var writer = new ArrowFileWriter(ms, built, leaveOpen: true))
        {
            writer.WriteRecordBatch(new RecordBatch(built, arrays, table.RowCount));
            writer.WriteEnd();
        }
        return ms.ToArray();
    }

    private static IArrowArray ToArrow(Column col)
    {
        var n = col.Length;
        switch (col)
        {
            case Int64Column ic:
            {
                var (bitmap, nulls) = Bitmap(ic.Validity);
                return new Int64Array(new ArrowBuffer(System.Runtime.InteropServices.MemoryMarshal.AsBytes(ic.Span).ToArray()), bitmap, n, nulls, 0);
            }
            case Float64Column fc:
            {
                var (bitmap, nulls) = Bitmap(fc.Validity);
                return new DoubleArray(new ArrowBuffer(System.Runtime.InteropServices.MemoryMarshal.AsBytes(fc.Span).ToArray()), bitmap, n, nulls, 0);
            }
            case TimestampColumn tc:
            {
                var (bitmap, nulls) = Bitmap(tc.Validity);
                return new TimestampArray(new TimestampType(TimeUnit.Microsecond, "UTC"), new ArrowBuffer(System.Runtime.InteropServices.MemoryMarshal.AsBytes(tc.Span).ToArray()), bitmap, n, nulls, 0);
            }
            case BoolColumn bc:
            {
                var b = new BooleanArray.Builder();
                for (var i = 0; i < n; i++)
                {
                    if (bc.Validity.IsValid(i)) b.Append(bc.Span[i]);
                    else b.AppendNull();
                }
                return b.Build();
            }
            case Utf8Column uc:
            {
                var b = new StringArray.Builder();
                for (var i = 0; i < n; i++)
                {
                    if (uc.IsMissing(i)) b.AppendNull();
                    else b.Append(uc.GetString(i));
                }
                return b.Build();
            }
            default:
            {
                var b = new StringArray.Builder();
                for (var i = 0; i < n; i++) b.Append(CellText.Display(col.GetValue(i)));
                return b.Build();
            }
        }
    }

    private static (ArrowBuffer Bitmap, int Nulls) Bitmap(Validity v)
    {
        var nulls = v.NullCount;
        if (nulls == 0) return (ArrowBuffer.Empty, 0);
        var bits = new byte[(v.Length + 7) >> 3];
        for (var i = 0; i < v.Length; i++)
            if (v.IsValid(i)) bits[i >> 3] |= (byte)(1 << (i & 7));
        return (new ArrowBuffer(bits), nulls);
    }

    /// <summary>Reads a file written by <see cref="Write"/> back into a table; anything else is an E-GOLDEN error naming <paramref name="displayPath"/>.</summary>
    public static Table Read(byte[] bytes, Mode mode, string displayPath)
    {
        try
        {
            using var ms = new MemoryStream(bytes, writable: false);
            using var reader = new ArrowFileReader(ms);
            var batch = reader.ReadNextRecordBatch();
            if (batch is null) throw Bad(displayPath, "the Arrow file holds no record batch");
            if (reader.ReadNextRecordBatch() is not null) throw Bad(displayPath, "the Arrow file holds more than one record batch");
            var schema = reader.Schema;
            var names = new string[schema.FieldsList.Count];
            var cols = new Column[names.Length];
            for (var c = 0; c < names.Length; c++)
            {
                var field = schema.FieldsList[c];
                names[c] = field.Name;
                var label = field.Metadata is not null && field.Metadata.TryGetValue(TypeKey, out var l) ? l : "";
                if (!ColumnTypes.TryParseLabel(label, out var type)) throw Bad(displayPath, "field '" + CellText.Safe(field.Name) + "' has no parity.type label");
                cols[c] = FromArrow(batch.Column(c), type, mode, displayPath);
            }
            return new Table(names, cols, batch.Length);
        }
        catch (EngineException)
        {
            throw;
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            throw Bad(displayPath, "not a readable Arrow IPC file: " + ex.Message);
        }
    }

    private static Column FromArrow(IArrowArray array, ColumnType type, Mode mode, string displayPath)
    {
        var marker = mode.Missing;
        switch (type)
        {
            case ColumnType.Int64 when array is Int64Array a:
                return new Int64Column(a.Values.ToArray(), ValidityOf(a), marker);
            case ColumnType.Float64 when array is DoubleArray a:
                return new Float64Column(a.Values.ToArray(), ValidityOf(a), marker);
            case ColumnType.Timestamp when array is TimestampArray a:
                return new TimestampColumn(a.Values.ToArray(), ValidityOf(a), marker);
            case ColumnType.Bool when array is BooleanArray a:
            {
                var data = new bool[a.Length];
                for (var i = 0; i < data.Length; i++) data[i] = a.GetValue(i) ?? false;
                return new BoolColumn(data, ValidityOf(a), marker);
            }
            case ColumnType.Utf8 when array is StringArray a:
            {
                var b = new Utf8ColumnBuilder(a.Length, 0);
                for (var i = 0; i < a.Length; i++)
                {
                    if (a.IsNull(i)) b.AppendMissing();
                    else b.Append(a.GetBytes(i));
                }
                return b.Build(marker);
            }
            case ColumnType.Object when array is StringArray a:
            {
                var cells = new object?[a.Length];
                for (var i = 0; i < a.Length; i++)
                {
                    if (!CellText.TryParse(a.GetString(i), out var v, out var error))
                        throw Bad(displayPath, "object cell " + i.ToString(System.Globalization.CultureInfo.InvariantCulture) + ": " + error);
                    cells[i] = v.IsMissing && v.Missing != MissingKind.NaN ? null : ObjectColumn.ToCell(v);
                }
                return new ObjectColumn(cells, marker);
            }
            default:
                throw Bad(displayPath, "a " + type.Label() + " column is stored as Arrow " + array.Data.DataType.Name);
        }
    }

    private static Validity ValidityOf(Apache.Arrow.Array a)
    {
        if (a.NullCount == 0) return Validity.AllValid(a.Length);
        return new Validity(a.NullBitmapBuffer.Memory.ToArray(), a.Offset, a.Length);
    }

    private static EngineException Bad(string file, string message) => new(ErrorCodes.Golden, message, file, 0, 0);
}
