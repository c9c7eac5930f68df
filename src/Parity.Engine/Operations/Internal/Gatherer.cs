using Parity.Engine.Columns;

namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Row gathers for the operations. Arrow UTF-8 columns get a two-pass kernel (sum the byte lengths, then one
/// exact allocation and span copies); other columns use their own <see cref="Column.Gather"/>.
/// </summary>
internal static class Gatherer
{
    public static Column Gather(Column column, ReadOnlySpan<int> rows) =>
        column is Utf8Column u ? GatherUtf8(u, rows) : column.Gather(rows);

    private static Utf8Column GatherUtf8(Utf8Column column, ReadOnlySpan<int> rows)
    {
        var offsets = column.Offsets;
        var data = column.Data;
        var array = column.Array;
        var anyNull = array.NullCount > 0;
        // Pass 1 reads each source row's offsets once (the random access), writes the new offsets and keeps
        // the source start; pass 2 copies bytes with sequential reads of those two arrays.
        // Offsets are written straight into the Arrow buffer's bytes; the source starts live in a pooled array.
        var offsetBytes = new byte[((long)rows.Length + 1) * 4];
        var newOffsets = System.Runtime.InteropServices.MemoryMarshal.Cast<byte, int>(offsetBytes.AsSpan());
        var from = System.Buffers.ArrayPool<int>.Shared.Rent(rows.Length);
        long total = 0;
        var nulls = 0;
        byte[]? bits = null;
        for (var i = 0; i < rows.Length; i++)
        {
            var r = rows[i];
            if (r < 0 || (anyNull && array.IsNull(r)))
            {
                nulls++;
                bits ??= AllValidBits(rows.Length);
                bits[i >> 3] &= (byte)~(1 << (i & 7));
                from[i] = 0;
            }
            else
            {
                var start = offsets[r];
                from[i] = start;
                total += offsets[r + 1] - start;
                if (total > Array.MaxLength) throw new InvalidOperationException("string data too large for one Arrow UTF-8 array");
            }
            newOffsets[i + 1] = (int)total;
        }
        var bytes = GC.AllocateUninitializedArray<byte>((int)total);
        var dst = bytes.AsSpan();
        for (var i = 0; i < rows.Length; i++)
        {
            var at = newOffsets[i];
            var length = newOffsets[i + 1] - at;
            if (length != 0) data.Slice(from[i], length).CopyTo(dst[at..]);
        }
        System.Buffers.ArrayPool<int>.Shared.Return(from);
        var bitmap = bits is null ? Apache.Arrow.ArrowBuffer.Empty : new Apache.Arrow.ArrowBuffer(bits);
        return new Utf8Column(new Apache.Arrow.StringArray(rows.Length, new Apache.Arrow.ArrowBuffer(offsetBytes), new Apache.Arrow.ArrowBuffer(bytes), bitmap, nulls, 0), column.Marker);
    }

    /// <summary>A bitmap with every slot valid (clear bits are set as missing rows are met).</summary>
    private static byte[] AllValidBits(int length)
    {
        var bits = new byte[(length + 7) >> 3];
        bits.AsSpan().Fill(0xFF);
        if ((length & 7) != 0) bits[^1] = (byte)((1 << (length & 7)) - 1);
        return bits;
    }
}
