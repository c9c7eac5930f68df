using System.Buffers;
using System.IO.MemoryMappedFiles;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// A read-only memory-mapped file exposed as <see cref="Memory{T}"/>. Non-owning from Arrow's point of view:
/// Apache.Arrow buffers wrap slices of <see cref="MemoryManager{T}.Memory"/>, which keep this object (and so the
/// mapping) reachable. There is deliberately no finalizer (CA2015): a span taken from a mapped buffer may
/// outlive every reference to this object, so unmapping on collection could free memory still in use; a
/// mapping therefore stays until <see cref="IDisposable.Dispose"/> or process exit (address space only: the
/// pages are file-backed and the OS reclaims them). Never handed to Arrow's NativeMemoryManager, which would
/// try to free memory it does not own.
/// </summary>
internal sealed unsafe class MappedMemory : MemoryManager<byte>
{
    private readonly MemoryMappedFile _file;
    private readonly MemoryMappedViewAccessor _view;
    private readonly byte* _pointer;
    private readonly int _length;
    private int _released;

    private MappedMemory(MemoryMappedFile file, MemoryMappedViewAccessor view, int length)
    {
        _file = file;
        _view = view;
        _length = length;
        byte* p = null;
        view.SafeMemoryMappedViewHandle.AcquirePointer(ref p);
        _pointer = p + view.PointerOffset;
    }

    /// <summary>Maps <paramref name="path"/> read-only; the caller has checked it exists and is not empty.</summary>
    public static MappedMemory Open(string path, long length)
    {
        if (length > int.MaxValue) throw new IOException("files above 2 GiB are not mapped as one Arrow IPC buffer");
        var file = MemoryMappedFile.CreateFromFile(path, FileMode.Open, null, 0, MemoryMappedFileAccess.Read);
        try
        {
            var view = file.CreateViewAccessor(0, length, MemoryMappedFileAccess.Read);
            return new MappedMemory(file, view, (int)length);
        }
        catch
        {
            file.Dispose();
            throw;
        }
    }

    public override Span<byte> GetSpan() => new(_pointer, _length);

    // The mapping never moves: pinning is a no-op that hands out the address.
    public override MemoryHandle Pin(int elementIndex = 0) => new(_pointer + elementIndex);

    public override void Unpin()
    {
    }

    protected override void Dispose(bool disposing)
    {
        if (Interlocked.Exchange(ref _released, 1) != 0) return;
        _view.SafeMemoryMappedViewHandle.ReleasePointer();
        _view.Dispose();
        _file.Dispose();
    }
}
