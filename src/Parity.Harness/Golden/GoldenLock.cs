using Parity.Engine.Errors;
using Parity.Engine.Files;

namespace Parity.Harness.Golden;

/// <summary>
/// The accept lock: an exclusive OS lock on <c>.lock</c> in the store root. The OS releases it when the
/// holder exits, even when killed, so a lock file left on disk is never stale by itself.
/// </summary>
public sealed class GoldenLock : IDisposable
{
    private readonly FileStream _stream;

    private GoldenLock(FileStream stream)
    {
        _stream = stream;
    }

    /// <summary>Takes the lock or throws E-GOLDEN-LOCK naming the lock file.</summary>
    public static GoldenLock Acquire(string root, string displayRoot)
    {
        Directory.CreateDirectory(root);
        var path = Path.Combine(root, GoldenNames.LockFile);
        // The lock file is ours: a link or anything but a regular file in its place (a committed FIFO would
        // block the open) is removed first.
        if (SafeFile.IsLink(path) || (Path.Exists(path) && !SafeFile.IsRegularFile(path)))
        {
            try { File.Delete(path); }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException) { }
        }
        try
        {
            var fs = new FileStream(path, FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
            return new GoldenLock(fs);
        }
        catch (IOException)
        {
            throw new EngineException(ErrorCodes.GoldenLock,
                "another `parity accept` holds the golden store lock; wait for it to finish and run again (the lock is released when that process exits)",
                displayRoot.TrimEnd('/') + "/" + GoldenNames.LockFile, 0, 0);
        }
    }

    public void Dispose() => _stream.Dispose();
}
