using System.Text;
using Apache.Arrow;
using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Column = Parity.Engine.Columns.Column;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// Strings held as one Arrow UTF-8 array. Under <c>arrow</c> storage the array is the column (no decoding);
/// under <c>boxed</c> each cell is decoded once into a managed string (shared by the boxed modes). A missing
/// cell under <c>boxed+nan</c> is a boxed NaN when the file wrote nothing there (CSV) and a null reference
/// (<c>None</c>) when the file stored a null (Parquet, Arrow IPC); spec §2.1, §2.2.
/// </summary>
internal sealed class SourceStrings(string name, StringArray array, bool nullIsNone) : SourceColumn(name, array.Length)
{
    private string?[]? _decoded;

    public StringArray Array => array;

    public override Column ToColumn(Mode mode)
    {
        if (mode.IsArrow) return new Utf8Column(array, mode.Missing);
        var strings = Decoded();
        var cells = new object?[strings.Length];
        var fill = mode.IsNan && !nullIsNone ? SharedBoxes.NaN : null;
        for (var i = 0; i < cells.Length; i++) cells[i] = strings[i] ?? fill;
        return new ObjectColumn(cells, mode.Missing);
    }

    public override SourceColumn Take(int[] rows)
    {
        var offsets = new int[rows.Length + 1];
        long bytes = 0;
        for (var i = 0; i < rows.Length; i++)
        {
            if (!array.IsNull(rows[i])) bytes += array.GetBytes(rows[i]).Length;
            offsets[i + 1] = (int)Math.Min(bytes, int.MaxValue);
        }
        var data = new byte[bytes];
        var flags = new bool[rows.Length];
        var nulls = 0;
        for (var i = 0; i < rows.Length; i++)
        {
            if (array.IsNull(rows[i])) { nulls++; continue; }
            flags[i] = true;
            array.GetBytes(rows[i]).CopyTo(data.AsSpan(offsets[i]));
        }
        var offsetBytes = new byte[offsets.Length * 4];
        System.Runtime.InteropServices.MemoryMarshal.AsBytes(offsets.AsSpan()).CopyTo(offsetBytes);
        var bitmap = nulls == 0 ? ArrowBuffer.Empty : new ArrowBuffer(Validity.FromFlags(flags).Bits);
        return new SourceStrings(Name, new StringArray(rows.Length, new ArrowBuffer(offsetBytes), new ArrowBuffer(data), bitmap, nulls), nullIsNone);
    }

    private string?[] Decoded()
    {
        if (_decoded is not null) return _decoded;
        var result = new string?[array.Length];
        for (var i = 0; i < result.Length; i++)
            if (!array.IsNull(i)) result[i] = Encoding.UTF8.GetString(array.GetBytes(i));
        _decoded = result;
        return result;
    }
}
