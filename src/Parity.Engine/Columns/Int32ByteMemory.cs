using System.Buffers;
using System.Runtime.InteropServices;

namespace Parity.Engine.Columns;

/// <summary>
/// A slice of an <c>int[]</c> seen as bytes, so a builder's offsets become an Arrow offsets buffer without a copy
/// (Apache.Arrow's <see cref="Apache.Arrow.ArrowBuffer"/> takes <c>ReadOnlyMemory&lt;byte&gt;</c>). Pinning pins the
/// array for as long as the returned handle lives.
/// </summary>
internal sealed class Int32ByteMemory(int[] array, int start, int length) : MemoryManager<byte>
{
    public override Span<byte> GetSpan() => MemoryMarshal.AsBytes(array.AsSpan(start, length));

    public override unsafe MemoryHandle Pin(int elementIndex = 0)
    {
        var handle = GCHandle.Alloc(array, GCHandleType.Pinned);
        var first = (byte*)handle.AddrOfPinnedObject() + (long)start * sizeof(int);
        return new MemoryHandle(first + elementIndex, handle, this);
    }

    public override void Unpin()
    {
    }

    protected override void Dispose(bool disposing)
    {
    }

    /// <summary>The bytes of <paramref name="offsets"/>: wrapped when an array backs them, else copied.</summary>
    public static ReadOnlyMemory<byte> Of(ReadOnlyMemory<int> offsets) =>
        MemoryMarshal.TryGetArray(offsets, out var segment) && segment.Array is { } array
            ? new Int32ByteMemory(array, segment.Offset, segment.Count).Memory
            : MemoryMarshal.AsBytes(offsets.Span).ToArray();
}
