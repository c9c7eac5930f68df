using System.Buffers;
using System.Runtime.InteropServices;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// Reinterprets a byte buffer as a buffer of <typeparamref name="T"/> without copying (an Arrow int64 or
/// double buffer as <c>ReadOnlyMemory&lt;long&gt;</c>). Keeps the source memory, and so its owner, reachable.
/// </summary>
internal sealed class CastMemory<T>(ReadOnlyMemory<byte> bytes) : MemoryManager<T>
    where T : unmanaged
{
    public override Span<T> GetSpan() => MemoryMarshal.Cast<byte, T>(MemoryMarshal.AsMemory(bytes).Span);

    public override unsafe MemoryHandle Pin(int elementIndex = 0)
    {
        var byteIndex = elementIndex * sizeof(T);
        if (MemoryMarshal.TryGetArray(bytes, out var segment) && segment.Array is not null)
        {
            var gc = GCHandle.Alloc(segment.Array, GCHandleType.Pinned);
            return new MemoryHandle((byte*)gc.AddrOfPinnedObject() + segment.Offset + byteIndex, gc);
        }
        // Native or mapped memory does not move; the owner keeps it alive while this object is reachable.
        fixed (byte* p = bytes.Span)
            return new MemoryHandle(p + byteIndex);
    }

    public override void Unpin()
    {
    }

    protected override void Dispose(bool disposing)
    {
    }

    public static ReadOnlyMemory<T> Wrap(ReadOnlyMemory<byte> bytes) =>
        bytes.IsEmpty ? ReadOnlyMemory<T>.Empty : new CastMemory<T>(bytes).Memory;
}
