using System.Runtime.InteropServices;
using Microsoft.Data.Analysis;
using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Values;

namespace Parity.Interop;

/// <summary>
/// A checkpoint frame as a <see cref="DataFrame"/> (docs/data.md, "Frames from code"). Every missing cell
/// becomes a DataFrame null, whatever its marker in the mode (NaN, None, null, NaT); a float NaN that is a
/// value (under <c>null</c> modes) stays a NaN value. Numeric buffers are copied in bulk; an Arrow string
/// column is handed over without copying its buffers when it starts at offset 0.
/// </summary>
internal static class TableFrames
{
    public static DataFrame ToDataFrame(Table table)
    {
        var columns = new DataFrameColumn[table.ColumnCount];
        for (var i = 0; i < columns.Length; i++)
            columns[i] = ToColumn(table.Names[i], table.Columns[i]);
        return new DataFrame(columns);
    }

    private static DataFrameColumn ToColumn(string name, Column column) => column switch
    {
        Int64Column c => new Int64DataFrameColumn(name, Bytes(c.Span), NullBits(column), c.Length, column.MissingCount),
        Float64Column c => new DoubleDataFrameColumn(name, Bytes(c.Span), NullBits(column), c.Length, column.MissingCount),
        BoolColumn c => new BooleanDataFrameColumn(name, Bytes(c.Span), NullBits(column), c.Length, column.MissingCount),
        TimestampColumn c => Timestamps(name, c),
        Utf8Column c => Utf8(name, c),
        ObjectColumn c => Objects(name, c),
        _ => throw new NotSupportedException("no DataFrame column for " + column.TypeLabel),
    };

    private static byte[] Bytes<T>(ReadOnlySpan<T> values) where T : struct => MemoryMarshal.AsBytes(values).ToArray();

    /// <summary>A bitmap (bit set = valid, least significant bit first, as Arrow) with bit offset 0.</summary>
    private static byte[] NullBits(Column column)
    {
        var bits = new byte[(column.Length + 7) >> 3];
        for (var i = 0; i < column.Length; i++)
            if (!column.IsMissing(i)) bits[i >> 3] |= (byte)(1 << (i & 7));
        return bits;
    }

    private static DateTimeDataFrameColumn Timestamps(string name, TimestampColumn c)
    {
        var values = new DateTime?[c.Length];
        var span = c.Span;
        for (var i = 0; i < values.Length; i++)
            values[i] = c.IsMissing(i) ? null : DateTime.SpecifyKind(ValueText.FromMicros(span[i]), DateTimeKind.Utc);
        return new DateTimeDataFrameColumn(name, values);
    }

    private static ArrowStringDataFrameColumn Utf8(string name, Utf8Column c)
    {
        var array = c.Array;
        // The data and offsets buffers are shared; the validity bitmap is rebuilt (the DataFrame column wants
        // one even when nothing is missing).
        if (array.Offset == 0)
            return new ArrowStringDataFrameColumn(name, array.ValueBuffer.Memory, array.ValueOffsetsBuffer.Memory, NullBits(c), c.Length, array.NullCount);
        // A slice: rebase the offsets to start at 0 (the data bytes are shared).
        var offsets = c.Offsets;
        var rebased = new int[c.Length + 1];
        var start = offsets[0];
        for (var i = 0; i < rebased.Length; i++) rebased[i] = offsets[i] - start;
        var data = array.ValueBuffer.Memory.Slice(start, offsets[c.Length] - start);
        return new ArrowStringDataFrameColumn(name, data, MemoryMarshal.AsBytes<int>(rebased).ToArray(), NullBits(c), c.Length, c.MissingCount);
    }

    /// <summary>
    /// Boxed cells: strings only (or bools only) give a string (bool) column; a mixed column has no DataFrame
    /// counterpart and becomes a string column of each value's text form.
    /// </summary>
    private static DataFrameColumn Objects(string name, ObjectColumn c)
    {
        var cells = c.Cells.Span;
        var allBool = true;
        for (var i = 0; i < cells.Length; i++)
            if (!c.IsMissing(i) && cells[i] is not bool) { allBool = false; break; }
        if (allBool && c.MissingCount < c.Length)
        {
            var flags = new bool?[cells.Length];
            for (var i = 0; i < flags.Length; i++) flags[i] = c.IsMissing(i) ? null : (bool)cells[i]!;
            return new BooleanDataFrameColumn(name, flags);
        }
        var strings = new string?[cells.Length];
        for (var i = 0; i < strings.Length; i++)
            strings[i] = c.IsMissing(i) ? null : cells[i] as string ?? ValueText.Format(c.GetValue(i));
        return new StringDataFrameColumn(name, strings);
    }
}
