using System.Runtime.InteropServices;
using Parity.Engine.Columns;

namespace Parity.Harness.Diffing.Internal;

/// <summary>
/// The differ's bulk test: are rows [start, start+count) of two columns certainly the same cell for cell?
/// True only when the buffers say so byte for byte (values, validity, and for Arrow strings the lengths from
/// the offsets and the data bytes), so the cell-by-cell comparison can skip the block. False means "look at
/// the cells", never "they differ": unequal bits can still be equal cells (-0.0 and 0.0, the bytes under a
/// missing slot), which the cell comparison decides.
/// </summary>
internal sealed class BlockEquality
{
    private readonly Column _a;
    private readonly Column _b;

    private BlockEquality(Column a, Column b)
    {
        _a = a;
        _b = b;
    }

    /// <summary>
    /// A checker when the two columns store cells the same way: one column class and type, and one missing
    /// marker (or, outside float64 and object columns, no missing cell in either, where the marker cannot
    /// show). Null when only the cell comparison can tell.
    /// </summary>
    public static BlockEquality? For(Column a, Column b)
    {
        if (a.GetType() != b.GetType() || a.Type != b.Type) return null;
        if (a.Marker != b.Marker)
        {
            if (a.Type is ColumnType.Float64 or ColumnType.Object) return null;
            if (a.MissingCount != 0 || b.MissingCount != 0) return null;
        }
        return a is Int64Column or Float64Column or BoolColumn or TimestampColumn or Utf8Column or ObjectColumn ? new BlockEquality(a, b) : null;
    }

    public bool Same(int start, int count) => (_a, _b) switch
    {
        (PrimitiveColumn<long> x, PrimitiveColumn<long> y) => Primitive(x, y, start, count),
        (PrimitiveColumn<double> x, PrimitiveColumn<double> y) => Primitive(x, y, start, count),
        (PrimitiveColumn<bool> x, PrimitiveColumn<bool> y) => Primitive(x, y, start, count),
        (Utf8Column x, Utf8Column y) => Utf8(x, y, start, count),
        (ObjectColumn x, ObjectColumn y) => Objects(x, y, start, count),
        _ => false,
    };

    private static bool Primitive<T>(PrimitiveColumn<T> x, PrimitiveColumn<T> y, int start, int count)
        where T : unmanaged
    {
        var vx = MemoryMarshal.AsBytes(x.Span.Slice(start, count));
        var vy = MemoryMarshal.AsBytes(y.Span.Slice(start, count));
        return vx.SequenceEqual(vy) && ValiditySame(x.Validity, y.Validity, start, count);
    }

    private static bool Utf8(Utf8Column x, Utf8Column y, int start, int count)
    {
        var ox = x.Offsets.Slice(start, count + 1);
        var oy = y.Offsets.Slice(start, count + 1);
        // Offsets are absolute and may start anywhere: equal lengths means equal differences.
        var delta = oy[0] - ox[0];
        if (delta == 0)
        {
            if (!ox.SequenceEqual(oy)) return false;
        }
        else
        {
            for (var i = 1; i < ox.Length; i++)
                if (oy[i] - ox[i] != delta) return false;
        }
        if (!x.Data[ox[0]..ox[^1]].SequenceEqual(y.Data[oy[0]..oy[^1]])) return false;
        return ValiditySame(Validity(x), Validity(y), start, count);
    }

    private static Validity Validity(Utf8Column u)
    {
        var array = u.Array;
        if (array.NullCount == 0 || array.NullBitmapBuffer.IsEmpty) return Engine.Columns.Validity.AllValid(u.Length);
        return new Validity(array.NullBitmapBuffer.Memory, array.Offset, u.Length);
    }

    private static bool Objects(ObjectColumn x, ObjectColumn y, int start, int count)
    {
        var cx = x.Cells.Span.Slice(start, count);
        var cy = y.Cells.Span.Slice(start, count);
        for (var i = 0; i < cx.Length; i++)
        {
            var a = cx[i];
            var b = cy[i];
            if (ReferenceEquals(a, b)) continue;
            if (a is string sa && b is string sb && string.Equals(sa, sb, StringComparison.Ordinal)) continue;
            return false;
        }
        return true;
    }

    /// <summary>Same validity bits over the rows (Arrow columnar format bitmaps, LSB first).</summary>
    private static bool ValiditySame(Validity x, Validity y, int start, int count)
    {
        if (!x.HasBitmap && !y.HasBitmap) return true;
        if (x.HasBitmap && y.HasBitmap && ((x.BitOffset + start) & 7) == 0 && ((y.BitOffset + start) & 7) == 0)
        {
            var bx = x.Bits.Span[((x.BitOffset + start) >> 3)..];
            var by = y.Bits.Span[((y.BitOffset + start) >> 3)..];
            var whole = count >> 3;
            if (!bx[..whole].SequenceEqual(by[..whole])) return false;
            for (var i = whole << 3; i < count; i++)
                if (x.IsValid(start + i) != y.IsValid(start + i)) return false;
            return true;
        }
        for (var i = 0; i < count; i++)
            if (x.IsValid(start + i) != y.IsValid(start + i)) return false;
        return true;
    }
}
