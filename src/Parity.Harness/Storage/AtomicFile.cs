using Parity.Engine.Files;

namespace Parity.Harness.Storage;

/// <summary>
/// Writes a file so that a reader sees the old content or the new, never a part: a temporary file in the
/// same folder (same file system, so the move is a rename), flushed to disk, then moved over the target.
/// Golden files, reports and generated fixtures all go through here.
/// </summary>
public static class AtomicFile
{
    /// <summary>Writes through <see cref="SafeFile.WriteAtomic"/>: never through a link; a failure is <c>E-FILE-WRITE</c>.</summary>
    public static void Write(string path, Action<Stream> write) => SafeFile.WriteAtomic(path, write);

    public static void WriteAllBytes(string path, ReadOnlySpan<byte> bytes)
    {
        var copy = bytes.ToArray();
        Write(path, stream => stream.Write(copy));
    }

    public static void WriteAllText(string path, string text) =>
        Write(path, stream => stream.Write(new System.Text.UTF8Encoding(false).GetBytes(text)));
}
