using Microsoft.Win32.SafeHandles;

namespace Parity.Engine.Files;

/// <summary>
/// A regular file opened by <see cref="SafeFile.OpenRead"/>: its handle (checked after opening, so nothing can
/// swap the file between the check and the read), its real path and its size at opening. Further streams
/// over the same file come from <see cref="OpenStream"/>, which reopens the very file the handle holds
/// (<c>/proc/self/fd/N</c> on Linux), not whatever the path names by then.
/// </summary>
public sealed class OpenedFile : IDisposable
{
    internal OpenedFile(SafeFileHandle handle, string realPath, long length, string reopenPath)
    {
        Handle = handle;
        RealPath = realPath;
        Length = length;
        ReopenPath = reopenPath;
    }

    public SafeFileHandle Handle { get; }

    /// <summary>The physical path of the opened file (every link resolved).</summary>
    public string RealPath { get; }

    /// <summary>The size in bytes when it was opened.</summary>
    public long Length { get; }

    /// <summary>A path that opens this same file while the handle is open.</summary>
    public string ReopenPath { get; }

    /// <summary>A new read stream over the same file, from the start.</summary>
    public FileStream OpenStream(int bufferSize = 1 << 16) =>
        new(ReopenPath, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize);

    /// <summary>Every byte, read through the handle; a file that grew past its opening size is not read further.</summary>
    public byte[] ReadAllBytes()
    {
        var bytes = new byte[Length];
        var done = 0;
        while (done < bytes.Length)
        {
            var n = RandomAccess.Read(Handle, bytes.AsSpan(done), done);
            if (n == 0) break;
            done += n;
        }
        return done == bytes.Length ? bytes : bytes[..done];
    }

    public void Dispose() => Handle.Dispose();
}
