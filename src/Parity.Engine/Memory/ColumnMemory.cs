using Parity.Engine.Columns;

namespace Parity.Engine.Memory;

/// <summary>
/// The bytes a column's storage holds (spec §4 <c>inspect</c>; formulas and sources in docs/data.md).
/// <list type="bullet">
/// <item>Arrow buffers: each buffer is counted at its length rounded up to a multiple of 64 bytes, the
/// alignment and padding the Arrow columnar format recommends ("Buffer Alignment and Padding") and what
/// Apache.Arrow's builders allocate. Utf8: validity (only when a cell is missing) + offsets (n+1 int32) +
/// data bytes. Fixed width: validity + values (8 bytes per int64/float64/timestamp, 1 bit per bool).</item>
/// <item>Boxed cells (64-bit .NET): the object array (24-byte header + 8 bytes per reference) plus each
/// distinct object once: a string is 20 bytes (header 8, method table 8, length 4) + 2 bytes per UTF-16 unit
/// including the terminating NUL, rounded up to 8 (at least 24); a boxed long, double, bool or DateTime is 24.</item>
/// </list>
/// Numeric, bool and timestamp columns are laid out the same under both string storages, so they are counted
/// by the Arrow formula whichever storage holds them.
/// </summary>
public static class ColumnMemory
{
    /// <summary>Object header (sync block) + method table pointer on 64-bit .NET.</summary>
    public const int ObjectHeaderBytes = 16;

    /// <summary>A boxed long, double, bool or DateTime: header 16 + payload padded to 8.</summary>
    public const int BoxedScalarBytes = 24;

    public const int ReferenceBytes = 8;

    /// <summary>An array's header: object header 16 + length field padded to 8.</summary>
    public const int ArrayHeaderBytes = 24;

    public const int ArrowPadding = 64;

    /// <summary>The bytes <paramref name="column"/> holds in the storage it is in.</summary>
    public static long Bytes(Column column) => column switch
    {
        ObjectColumn o => Boxed(o),
        Utf8Column u => Arrow(u),
        BoolColumn b => ArrowValidity(b.Length, b.Validity.NullCount) + Pad(((long)b.Length + 7) >> 3),
        PrimitiveColumn<long> p => ArrowValidity(p.Length, p.Validity.NullCount) + Pad(8L * p.Length),
        PrimitiveColumn<double> d => ArrowValidity(d.Length, d.Validity.NullCount) + Pad(8L * d.Length),
        _ => 0,
    };

    /// <summary>Arrow UTF-8 array: validity (when any cell is missing) + offsets + data, each padded to 64.</summary>
    public static long Arrow(Utf8Column column)
    {
        var n = column.Length;
        var offsets = column.Offsets;
        var data = offsets.IsEmpty ? 0 : offsets[n] - offsets[0];
        return Utf8Bytes(n, column.MissingCount, data);
    }

    /// <summary>The Arrow UTF-8 formula: <c>pad(ceil(n/8)) [if nulls] + pad(4(n+1)) + pad(dataBytes)</c>.</summary>
    public static long Utf8Bytes(int count, int missing, long dataBytes) =>
        ArrowValidity(count, missing) + Pad(4L * (count + 1)) + Pad(dataBytes);

    /// <summary>Boxed storage: the reference array plus every distinct object once.</summary>
    public static long Boxed(ObjectColumn column)
    {
        var cells = column.Cells.Span;
        var total = ObjectArrayBytes(cells.Length);
        var seen = new HashSet<object>(ReferenceEqualityComparer.Instance);
        foreach (var cell in cells)
        {
            if (cell is null || !seen.Add(cell)) continue;
            total += ObjectBytes(cell);
        }
        return total;
    }

    /// <summary>An <c>object[]</c> of <paramref name="count"/> references.</summary>
    public static long ObjectArrayBytes(int count) => ArrayHeaderBytes + (long)ReferenceBytes * count;

    /// <summary>The size of one managed object on 64-bit .NET.</summary>
    public static long ObjectBytes(object value) => value switch
    {
        string s => StringBytes(s.Length),
        _ => BoxedScalarBytes,
    };

    /// <summary>A string of <paramref name="utf16Length"/> units: <c>max(24, round8(20 + 2(n+1)))</c>.</summary>
    public static long StringBytes(int utf16Length) => Math.Max(24, RoundUp(20L + 2L * (utf16Length + 1), 8));

    /// <summary>A buffer's length rounded up to the 64-byte padding of the Arrow columnar format.</summary>
    public static long Pad(long bytes) => RoundUp(bytes, ArrowPadding);

    /// <summary>A validity bitmap is omitted when no cell is missing (Arrow columnar format, "Validity bitmaps").</summary>
    public static long ArrowValidity(int count, int missing) => missing == 0 ? 0 : Pad(((long)count + 7) >> 3);

    private static long RoundUp(long value, long unit) => (value + unit - 1) / unit * unit;
}
