using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using Apache.Arrow;

namespace Parity.Engine.IO.Internal.ParquetPages;

/// <summary>
/// Raw UTF-8 values of one column, row group by row group, into the Arrow layout: one contiguous data buffer
/// (sized from the bytes per row seen so far) and int32 offsets written straight into the Arrow offsets buffer.
/// </summary>
internal sealed class ParquetUtf8Sink(int n)
{
    private readonly byte[] _offsetBytes = new byte[((long)n + 1) * 4];
    private readonly byte[] _bits = new byte[(n + 7) >> 3];
    private byte[] _data = [];
    private int _bytes;
    private int _nulls;
    private bool _splitStart;

    public int Rows { get; private set; }

    /// <summary>
    /// Makes room for <paramref name="more"/> bytes; with <paramref name="rowsAhead"/> rows to come, the first
    /// reservation extrapolates to the whole column so the buffer is allocated once. False above 2 GiB.
    /// </summary>
    public bool Reserve(long more, int rowsAhead)
    {
        if (_bytes + more > System.Array.MaxLength) return false;
        if (_bytes + more <= _data.Length) return true;
        var guess = Rows == 0 && rowsAhead > 0 ? more * n / rowsAhead + more / 16 + 64 : 0;
        var size = Math.Min(System.Array.MaxLength, Math.Max(Math.Max(guess, _bytes + more), _data.Length * 2L));
        var grown = GC.AllocateUninitializedArray<byte>((int)size);
        _data.AsSpan(0, _bytes).CopyTo(grown);
        _data = grown;
        return true;
    }

    /// <summary>Appends one present value; false when the column would pass 2 GiB of text.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public bool Append(ReadOnlySpan<byte> value)
    {
        if (value.Length > _data.Length - _bytes && !Reserve(value.Length, 0)) return false;
        if (value.Length > 0 && (value[0] & 0xC0) == 0x80) _splitStart = true;
        value.CopyTo(_data.AsSpan(_bytes));
        _bytes += value.Length;
        var row = Rows++;
        _bits[row >> 3] |= (byte)(1 << (row & 7));
        Offsets[row + 1] = _bytes;
        return true;
    }

    public void AppendMissing()
    {
        _nulls++;
        var row = Rows++;
        Offsets[row + 1] = _bytes;
    }

    /// <summary>
    /// Appends a row group as Parquet.Net's raw read gives it: present values packed first, definition levels per
    /// row (<paramref name="maxDef"/> = present). False when the column would pass 2 GiB of text.
    /// </summary>
    public bool Add(ReadOnlyMemory<byte>[] values, int[] defs, int count, int maxDef)
    {
        long groupBytes = 0;
        var present = 0;
        for (var i = 0; i < count; i++)
        {
            if (maxDef != 0 && defs[i] != maxDef) continue;
            groupBytes += values[present++].Length;
        }
        if (!Reserve(groupBytes, count)) return false;
        var k = 0;
        for (var i = 0; i < count; i++)
        {
            if (maxDef == 0 || defs[i] == maxDef) Append(values[k++].Span);
            else AppendMissing();
        }
        return true;
    }

    private Span<int> Offsets => MemoryMarshal.Cast<byte, int>(_offsetBytes.AsSpan());

    /// <summary>
    /// UTF-8 is checked once over the whole buffer (vectorised), plus that no value starts with a
    /// continuation byte: then every value is whole code points (Unicode Standard §3.9, Table 3-7; UTF-8
    /// is self-synchronising). Only a failure looks for the first bad row; -1 when all are valid.
    /// </summary>
    public int FirstInvalidRow()
    {
        if (!_splitStart && System.Text.Unicode.Utf8.IsValid(_data.AsSpan(0, _bytes))) return -1;
        var offsets = Offsets;
        for (var r = 0; r < Rows; r++)
            if (!System.Text.Unicode.Utf8.IsValid(_data.AsSpan(offsets[r], offsets[r + 1] - offsets[r]))) return r;
        return 0; // unreachable: a concatenation of valid UTF-8 values is valid
    }

    public StringArray Build() =>
        new(n, new ArrowBuffer(_offsetBytes), new ArrowBuffer(_data.AsMemory(0, _bytes)),
            _nulls == 0 ? ArrowBuffer.Empty : new ArrowBuffer(_bits), _nulls);
}
