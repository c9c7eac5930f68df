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
        long total = 0;
        var nulls = 0;
        for (var i = 0; i < rows.Length; i++)
        {
            var r = rows[i];
            if (r < 0 || (anyNull && array.IsNull(r))) { nulls++; continue; }
            total += offsets[r + 1] - offsets[r];
        }
        if (total > Array.MaxLength) throw new InvalidOperationException("string data too large for one Arrow UTF-8 array");
        var bytes = new byte[total];
        var newOffsets = new int[rows.Length + 1];
        var bits = nulls > 0 ? new byte[(rows.Length + 7) >> 3] : null;
        var at = 0;
        for (var i = 0; i < rows.Length; i++)
        {
            var r = rows[i];
            if (r >= 0 && !(anyNull && array.IsNull(r)))
            {
                var start = offsets[r];
                var length = offsets[r + 1] - start;
                data.Slice(start, length).CopyTo(bytes.AsSpan(at));
                at += length;
                if (bits is not null) bits[i >> 3] |= (byte)(1 << (i & 7));
            }
            newOffsets[i + 1] = at;
        }
        var validity = bits is null ? Validity.AllValid(rows.Length) : new Validity(bits, 0, rows.Length);
        return Utf8ColumnBuilder.FromBuffers(newOffsets, bytes, validity, column.Marker, nulls);
    }
}
