namespace Parity.Harness.Storage;

/// <summary>
/// Writes a file so that a reader sees the old content or the new, never a part: a temporary file in the
/// same folder (same file system, so the move is a rename), flushed to disk, then moved over the target.
/// Golden files, reports and generated fixtures all go through here.
/// </summary>
public static class AtomicFile
{
    public static void Write(string path, Action<Stream> write)
    {
        var full = Path.GetFullPath(path);
        var dir = Path.GetDirectoryName(full) ?? ".";
        Directory.CreateDirectory(dir);
        var temp = Path.Combine(dir, "." + Path.GetFileName(full) + "." + Guid.NewGuid().ToString("N") + ".tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }
            File.Move(temp, full, overwrite: true);
        }
        catch
        {
            TryDelete(temp);
            throw;
        }
    }

    public static void WriteAllBytes(string path, ReadOnlySpan<byte> bytes)
    {
        var copy = bytes.ToArray();
        Write(path, stream => stream.Write(copy));
    }

    public static void WriteAllText(string path, string text) =>
        Write(path, stream => stream.Write(new System.Text.UTF8Encoding(false).GetBytes(text)));

    private static void TryDelete(string path)
    {
        try { File.Delete(path); }
        catch (IOException) { }
        catch (UnauthorizedAccessException) { }
    }
}
