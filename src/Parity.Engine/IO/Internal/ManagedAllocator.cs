using System.Buffers;
using Apache.Arrow.Memory;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// An Apache.Arrow allocator over managed arrays: buffers the loader keeps (record batches read from a stream,
/// concatenated batches) live as long as the columns that reference them, with no native memory whose
/// lifetime depends on an owner being disposed or finalized at the right moment.
/// </summary>
internal sealed class ManagedAllocator : MemoryAllocator
{
    public static readonly ManagedAllocator Instance = new();

    protected override IMemoryOwner<byte> AllocateInternal(int length, out int bytesAllocated)
    {
        bytesAllocated = length;
        return new Owner(new byte[length]);
    }

    private sealed class Owner(byte[] array) : IMemoryOwner<byte>
    {
        public Memory<byte> Memory => array;

        public void Dispose()
        {
        }
    }
}
