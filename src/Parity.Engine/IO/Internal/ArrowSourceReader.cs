using Apache.Arrow;
using Apache.Arrow.Ipc;
using Apache.Arrow.Types;
using Parity.Engine.Columns;
using Parity.Engine.Errors;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// Reads Arrow IPC (file or stream format) from a memory-mapped file without copying: Apache.Arrow's
/// <see cref="ArrowStreamReader"/> over a <see cref="ReadOnlyMemory{T}"/> wraps buffers in place. The file
/// format is the stream format between the 8-byte "ARROW1\0\0" header and the footer (Arrow columnar format,
/// "IPC File Format"), so we skip the header and never need the footer. A single record batch is used as
/// it is (int64, double, timestamp[us] and utf8 columns share the mapped bytes); several batches are
/// concatenated, which copies. Narrow numbers, bools, large_utf8, string views and dictionaries are decoded.
/// </summary>
internal static class ArrowSourceReader
{
    private static readonly byte[] Magic = "ARROW1"u8.ToArray();

    /// <summary>Reads <paramref name="path"/> (the loader's reopen path of a checked, opened file) of <paramref name="length"/> bytes.</summary>
    public static SourceTable Read(string path, long length, string display)
    {
        if (length == 0) throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "the file is empty: not Arrow IPC");
        if (length > int.MaxValue) return ReadStreamed(path, display);
        MappedMemory mapped;
        try
        {
            mapped = MappedMemory.Open(path, length);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw LoadThrow.FileRead(display, ex.Message);
        }
        var col = 0;
        try
        {
            var memory = mapped.Memory;
            var start = memory.Span.StartsWith(Magic) ? 8 : 0;
            if (start == 8 && length < 8 + 4)
                throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "the file is truncated after its header");
            if (ArrowIpcPrecheck.Check(memory.Span[start..], start == 8) is { } corrupt)
                throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "not a sound Arrow IPC file: " + corrupt);
            using var reader = new ArrowStreamReader((ReadOnlyMemory<byte>)memory[start..]);
            return ReadBatches(reader, display, ref col);
        }
        catch (EngineException)
        {
            throw;
        }
        catch (OutOfMemoryException)
        {
            throw LoadThrow.OutOfMemory(display);
        }
        catch (Exception ex)
        {
            throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "cannot read as Arrow IPC: " + ex.Message, 0, col);
        }
    }

    /// <summary>Every batch, each checked against its buffers before use, assembled into one source table.</summary>
    private static SourceTable ReadBatches(ArrowStreamReader reader, string display, ref int col)
    {
        var batches = new List<RecordBatch>();
        RecordBatch? batch;
        while ((batch = reader.ReadNextRecordBatch()) is not null)
        {
            CheckBatch(batch, display);
            batches.Add(batch);
        }
        return Assemble(reader.Schema, batches, display, ref col);
    }

    /// <summary>
    /// A file above 2 GiB cannot be mapped as one buffer (Memory&lt;byte&gt; has an int length): Apache.Arrow reads
    /// it from a stream instead, each record batch into its own buffers. Our writer splits large tables into
    /// batches well below 2 GiB. (The message pre-check needs the bytes in memory, so it is skipped here.)
    /// </summary>
    internal static SourceTable ReadStreamed(string path, string display)
    {
        var col = 0;
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 20);
            Span<byte> head = stackalloc byte[6];
            var file = stream.Read(head) == 6 && head.SequenceEqual(Magic.AsSpan(0, 6));
            stream.Position = 0;
            using var reader = file ? new ArrowFileReader(stream, ManagedAllocator.Instance, leaveOpen: true) : new ArrowStreamReader(stream, ManagedAllocator.Instance, leaveOpen: true);
            return ReadBatches(reader, display, ref col);
        }
        catch (EngineException)
        {
            throw;
        }
        catch (OutOfMemoryException)
        {
            throw LoadThrow.OutOfMemory(display);
        }
        catch (IOException ex)
        {
            throw LoadThrow.FileRead(display, ex.Message);
        }
        catch (Exception ex)
        {
            throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "cannot read as Arrow IPC: " + ex.Message, 0, col);
        }
    }

    /// <summary>One source column per schema field, the batches of each concatenated (none: an empty array).</summary>
    private static SourceTable Assemble(Schema? readSchema, List<RecordBatch> batches, string display, ref int col)
    {
        var schema = readSchema ?? throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "no schema message");
        var rows = 0L;
        foreach (var b in batches) rows += b.Length;
        if (rows > System.Array.MaxLength) throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"{rows} rows are more than one table can hold");
        var columns = new SourceColumn[schema.FieldsList.Count];
        for (var c = 0; c < columns.Length; c++)
        {
            col = c + 1;
            var field = schema.FieldsList[c];
            var parts = new List<IArrowArray>(batches.Count);
            foreach (var b in batches) parts.Add(b.Column(c));
            IArrowArray array = parts.Count == 1 ? parts[0] : parts.Count == 0 ? EmptyOf(field.DataType, display, col) : ArrowArrayConcatenator.Concatenate(parts, ManagedAllocator.Instance);
            columns[c] = Convert(field.Name, array, display, col);
        }
        return new SourceTable(columns, (int)rows);
    }

    /// <summary>
    /// Rejects a batch whose lengths do not fit its buffers before anything is allocated from them: a corrupted
    /// length field would otherwise make the converters allocate arrays of that length (up to gigabytes) from a
    /// file of a few bytes. Apache Arrow columnar format: every column of a record batch has the batch's length;
    /// a fixed-width value buffer holds (offset + length) values, a validity bitmap one bit per slot, an offsets
    /// buffer (offset + length + 1) 32-bit entries.
    /// </summary>
    private static void CheckBatch(RecordBatch batch, string display)
    {
        for (var c = 0; c < batch.ColumnCount; c++)
        {
            var data = batch.Column(c).Data;
            if (data.Length != batch.Length)
                throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"column {c + 1} has {data.Length} rows in a record batch of {batch.Length}", 0, c + 1);
            CheckData(data, display, c + 1);
        }
    }

    private static void CheckData(ArrayData data, string display, int col)
    {
        if (data.Length < 0 || data.Offset < 0 || data.NullCount > data.Length)
            throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "negative array length or offset", 0, col);
        var slots = (long)data.Offset + data.Length;
        long? valueBytes = data.DataType switch
        {
            FixedWidthType f when data.DataType.TypeId != ArrowTypeId.Boolean => slots * ((f.BitWidth + 7) / 8),
            BooleanType => (slots + 7) / 8,
            StringType or BinaryType => (slots + 1) * 4,
            _ => null,
        };
        if (data.NullCount > 0 && data.Buffers.Length > 0 && !data.Buffers[0].IsEmpty && data.Buffers[0].Length < (slots + 7) / 8)
            throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "validity bitmap shorter than the array", 0, col);
        if (valueBytes is { } need && (data.Buffers.Length < 2 || data.Buffers[1].Length < need) && data.Length > 0)
            throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "value buffer shorter than the array", 0, col);
        if (data.DataType is StringType or BinaryType && data.Length > 0)
        {
            var offsets = System.Runtime.InteropServices.MemoryMarshal.Cast<byte, int>(data.Buffers[1].Span);
            var first = offsets[data.Offset];
            var last = offsets[(int)slots];
            var bytes = data.Buffers.Length > 2 ? data.Buffers[2].Length : 0;
            if (first < 0 || last < first || last > bytes)
                throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, "string offsets point outside the data buffer", 0, col);
        }
        if (data.Dictionary is not null) CheckData(data.Dictionary, display, col);
        if (data.Children is { } children)
            foreach (var child in children) CheckData(child, display, col);
    }

    private static IArrowArray EmptyOf(IArrowType type, string display, int col) => type.TypeId switch
    {
        ArrowTypeId.Int64 => new Int64Array.Builder().Build(),
        ArrowTypeId.Double => new DoubleArray.Builder().Build(),
        ArrowTypeId.Boolean => new BooleanArray.Builder().Build(),
        ArrowTypeId.Timestamp => new TimestampArray.Builder((TimestampType)type).Build(),
        ArrowTypeId.String => new StringArray.Builder().Build(),
        _ => new StringArray.Builder().Build(),
    };

    private static SourceColumn Convert(string name, IArrowArray array, string display, int col)
    {
        var data = array.Data;
        var n = array.Length;
        switch (array)
        {
            case Int64Array a:
                return new SourceInt64(name, Fixed<long>(a, 8), ValidityOf(a));
            case DoubleArray a:
                return new SourceFloat64(name, Fixed<double>(a, 8), ValidityOf(a));
            case TimestampArray a:
            {
                var type = (TimestampType)a.Data.DataType;
                if (type.Unit == TimeUnit.Microsecond)
                    return new SourceTimestamp(name, Fixed<long>(a, 8), ValidityOf(a));
                var raw = Fixed<long>(a, 8).Span;
                var micros = new long[n];
                for (var i = 0; i < n; i++)
                {
                    micros[i] = type.Unit switch
                    {
                        TimeUnit.Second => raw[i] * 1_000_000,
                        TimeUnit.Millisecond => raw[i] * 1_000,
                        _ => raw[i] / 1_000,
                    };
                }
                return new SourceTimestamp(name, micros, ValidityOf(a));
            }
            case Date32Array a:
            {
                var micros = new long[n];
                for (var i = 0; i < n; i++) micros[i] = (a.GetValue(i) ?? 0) * 86_400_000_000L;
                return new SourceTimestamp(name, micros, ValidityOf(a));
            }
            case Date64Array a:
            {
                var micros = new long[n];
                for (var i = 0; i < n; i++) micros[i] = (a.GetValue(i) ?? 0) * 1_000L;
                return new SourceTimestamp(name, micros, ValidityOf(a));
            }
            case BooleanArray a:
            {
                var values = new bool[n];
                for (var i = 0; i < n; i++) values[i] = a.GetValue(i) ?? false;
                return new SourceBool(name, values, ValidityOf(a));
            }
            case StringArray a when data.DataType.TypeId == ArrowTypeId.String:
                CheckStrings(a, name, display, col);
                return new SourceStrings(name, a, nullIsNone: true);
            case FloatArray a:
            {
                var values = new double[n];
                for (var i = 0; i < n; i++) values[i] = a.GetValue(i) ?? double.NaN;
                return new SourceFloat64(name, values, ValidityOf(a));
            }
            case Int32Array or Int16Array or Int8Array or UInt8Array or UInt16Array or UInt32Array or UInt64Array:
                return new SourceInt64(name, Widen(array, name, display, col), ValidityOf(array));
            default:
                if (IsText(data.DataType))
                    return new SourceStrings(name, DecodeText(array, name, display, col), nullIsNone: true);
                throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"column '{name}' has an Arrow type Parity does not load ({data.DataType.Name})", 0, col);
        }
    }

    private static bool IsText(IArrowType type) => type.TypeId switch
    {
        ArrowTypeId.LargeString or ArrowTypeId.StringView => true,
        ArrowTypeId.Dictionary => ((DictionaryType)type).ValueType.TypeId is ArrowTypeId.String or ArrowTypeId.LargeString or ArrowTypeId.StringView,
        _ => false,
    };

    /// <summary>The value buffer of a fixed-width array as typed memory over the same bytes (no copy).</summary>
    private static ReadOnlyMemory<T> Fixed<T>(IArrowArray array, int width)
        where T : unmanaged
    {
        var data = array.Data;
        var bytes = data.Buffers[1].Memory;
        var start = data.Offset * width;
        var length = data.Length * width;
        if (start + length > bytes.Length) throw new InvalidDataException("value buffer shorter than the array");
        return CastMemory<T>.Wrap(bytes.Slice(start, length));
    }

    /// <summary>Validity over the array's own bitmap (Arrow columnar format, "Validity bitmaps": LSB first).</summary>
    private static Validity ValidityOf(IArrowArray array)
    {
        var data = array.Data;
        if (data.NullCount == 0 || data.Buffers[0].IsEmpty) return Validity.AllValid(data.Length);
        var bits = data.Buffers[0].Memory;
        if (((data.Offset + data.Length + 7) >> 3) > bits.Length) throw new InvalidDataException("validity bitmap shorter than the array");
        return new Validity(bits, data.Offset, data.Length);
    }

    private static long[] Widen(IArrowArray array, string name, string display, int col)
    {
        var n = array.Length;
        var result = new long[n];
        for (var i = 0; i < n; i++)
        {
            if (array.IsNull(i)) continue;
            result[i] = array switch
            {
                Int32Array a => a.GetValue(i) ?? 0,
                Int16Array a => a.GetValue(i) ?? 0,
                Int8Array a => a.GetValue(i) ?? 0,
                UInt8Array a => a.GetValue(i) ?? 0,
                UInt16Array a => a.GetValue(i) ?? 0,
                UInt32Array a => a.GetValue(i) ?? 0,
                UInt64Array a => a.GetValue(i) is { } u && u <= long.MaxValue
                    ? (long)u
                    : throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"column '{name}' holds a uint64 above the int64 range", i + 1, col),
                _ => 0,
            };
        }
        return result;
    }

    /// <summary>
    /// Arrow columnar format, "Variable-size Binary Layout": n+1 offsets, non-decreasing, within the data
    /// buffer; and the bytes must be UTF-8. A corrupt file fails here with a located error, not later.
    /// </summary>
    private static void CheckStrings(StringArray a, string name, string display, int col)
    {
        var n = a.Length;
        var offsetBytes = a.ValueOffsetsBuffer.Memory;
        if ((long)(a.Offset + n + 1) * 4 > offsetBytes.Length) throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"column '{name}': offsets buffer too short", 0, col);
        if (a.NullCount > 0 && !a.NullBitmapBuffer.IsEmpty && ((a.Offset + n + 7) >> 3) > a.NullBitmapBuffer.Length)
            throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"column '{name}': validity bitmap shorter than the array", 0, col);
        var offsets = a.ValueOffsets;
        if (offsets[0] < 0) throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"column '{name}': negative offset", 1, col);
        var scan = Utf8ArrayScan.Run(CastMemory<int>.Wrap(offsetBytes.Slice(a.Offset * 4, (n + 1) * 4)), a.ValueBuffer.Memory);
        if (!scan.OffsetsSound)
        {
            var dataLength = a.ValueBuffer.Length;
            for (var i = 1; i <= n; i++)
                if (offsets[i] < offsets[i - 1] || offsets[i] > dataLength)
                    throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"column '{name}': offsets are not monotonic within the data buffer", i, col);
            throw LoadThrow.Error(ErrorCodes.ArrowIpc, display, $"column '{name}': offsets point outside the data buffer", 0, col);
        }
        if (!scan.Valid)
        {
            for (var i = 0; i < n; i++)
                if (!a.IsNull(i) && !System.Text.Unicode.Utf8.IsValid(a.GetBytes(i)))
                    throw LoadThrow.Error(ErrorCodes.Utf8, display, $"column '{name}' holds invalid UTF-8", i + 1, col);
        }
        // Invalid bytes only under missing slots pass the search above; a split character is still looked for then.
        if (scan.SplitCharacter || !scan.Valid)
        {
            var data = a.ValueBuffer.Span;
            for (var i = 0; i < n; i++)
            {
                var o = offsets[i];
                if (offsets[i + 1] > o && (data[o] & 0xC0) == 0x80)
                    throw LoadThrow.Error(ErrorCodes.Utf8, display, $"column '{name}' holds invalid UTF-8 (a value starts inside a character)", i + 1, col);
            }
        }
    }

    private static StringArray DecodeText(IArrowArray array, string name, string display, int col)
    {
        var b = new Utf8ColumnBuilder(array.Length, array.Length * 8);
        for (var i = 0; i < array.Length; i++)
        {
            if (array.IsNull(i))
            {
                b.AppendMissing();
                continue;
            }
            ReadOnlySpan<byte> bytes = array switch
            {
                LargeStringArray a => a.GetBytes(i),
                StringViewArray a => a.GetBytes(i),
                DictionaryArray d => DictionaryBytes(d, i),
                _ => default,
            };
            if (!System.Text.Unicode.Utf8.IsValid(bytes))
                throw LoadThrow.Error(ErrorCodes.Utf8, display, $"column '{name}' holds invalid UTF-8", i + 1, col);
            b.Append(bytes);
        }
        return b.Build(Modes.MissingMarker.Null).Array;
    }

    private static ReadOnlySpan<byte> DictionaryBytes(DictionaryArray d, int i)
    {
        var index = d.Indices switch
        {
            Int8Array x => x.GetValue(i) ?? 0,
            Int16Array x => x.GetValue(i) ?? 0,
            Int32Array x => x.GetValue(i) ?? 0,
            Int64Array x => checked((int)(x.GetValue(i) ?? 0)),
            UInt8Array x => x.GetValue(i) ?? 0,
            UInt16Array x => x.GetValue(i) ?? 0,
            UInt32Array x => checked((int)(x.GetValue(i) ?? 0)),
            _ => throw new InvalidDataException("unsupported dictionary index type"),
        };
        return d.Dictionary switch
        {
            StringArray s => s.GetBytes(index),
            LargeStringArray s => s.GetBytes(index),
            StringViewArray s => s.GetBytes(index),
            _ => throw new InvalidDataException("unsupported dictionary value type"),
        };
    }
}
