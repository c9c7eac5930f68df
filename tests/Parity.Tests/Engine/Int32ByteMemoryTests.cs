using System.Runtime.InteropServices;
using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Tests.Engine;

/// <summary>
/// A built utf8 column's offsets buffer is the builder's int array seen as bytes, not a copy (Apache Arrow columnar
/// format, "Variable-size Binary Layout": n+1 little-endian int32 offsets; x86 and ARM64 are little-endian).
/// </summary>
public sealed class Int32ByteMemoryTests
{
    [Fact]
    public unsafe void Offsets_are_wrapped_and_pin_to_the_same_bytes()
    {
        var b = new Utf8ColumnBuilder(2, 8);
        b.Append("Åsa");
        b.AppendMissing();
        b.Append("🚢");
        var column = b.Build(MissingMarker.Null);
        var offsets = column.Array.ValueOffsetsBuffer;
        // "Åsa" is 4 UTF-8 bytes and U+1F6A2 is 4 (Unicode, UTF-8, Table 3-7; from memory, checked by the values).
        Assert.Equal([0, 4, 4, 8], MemoryMarshal.Cast<byte, int>(offsets.Span).ToArray());
        Assert.False(MemoryMarshal.TryGetArray(offsets.Memory, out _)); // a view over the int array, not a byte[] copy
        using var pinned = offsets.Memory.Pin();
        Assert.Equal(8, ((int*)pinned.Pointer)[3]);
        Assert.Equal("🚢", column.GetString(2));
        Assert.True(column.IsMissing(1));
    }

    [Fact]
    public unsafe void A_slice_of_an_array_keeps_its_start()
    {
        var bytes = Int32ByteMemory.Of(new ReadOnlyMemory<int>([9, 0, 3, 7], 1, 3));
        Assert.Equal(12, bytes.Length);
        Assert.Equal([0, 3, 7], MemoryMarshal.Cast<byte, int>(bytes.Span).ToArray());
        using var pinned = bytes.Pin();
        Assert.Equal(7, ((int*)pinned.Pointer)[2]);
    }
}
