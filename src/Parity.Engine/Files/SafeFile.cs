using System.Globalization;
using Microsoft.Win32.SafeHandles;
using Parity.Engine.Errors;
using Parity.Engine.Files.Internal;

namespace Parity.Engine.Files;

/// <summary>
/// The one way Parity opens and writes files (scripts, data files, golden files, reports), because all of
/// them may come from someone hostile (docs/reliability.md, "Threat model"):
/// <list type="bullet">
/// <item>a path is resolved physically (<see cref="PhysicalPath"/>) before any root check, so no link can
/// lead a check one way and the open another;</item>
/// <item>only regular files are opened: a folder, FIFO, device or socket is <c>E-PATH</c>. On Linux the file is
/// opened without blocking and then checked through the handle (type, size and the real path the kernel
/// reports for it), so nothing can be swapped in between a check and the open;</item>
/// <item>a size cap is checked before a byte is read;</item>
/// <item>writes go to a new temporary file in the target's folder, then rename over the target: a link at the
/// target is replaced, never written through. A failed write is <c>E-FILE-WRITE</c>.</item>
/// </list>
/// </summary>
public static class SafeFile
{
    /// <summary>Opens a regular file for reading under <paramref name="rules"/>, or throws a located <see cref="EngineException"/>.</summary>
    public static OpenedFile OpenRead(string path, FileReadRules rules)
    {
        var display = rules.Display;
        var full = FullPath(path, display);
        var real = PhysicalPath.Resolve(full, out var exists);
        if (rules.Root is { } rootPath)
        {
            var realRoot = PhysicalPath.Resolve(FullPath(rootPath, display));
            if (!PhysicalPath.IsInside(real, realRoot)) throw Outside(rules, full, real);
        }
        if (!exists) throw new EngineException(ErrorCodes.FileNotFound, "no such file", display, 0, 0);
        return Posix.Available ? OpenPosix(real, rules) : OpenPortable(real, rules);
    }

    /// <summary>Every byte of a regular file under <paramref name="rules"/> (its size cap applies).</summary>
    public static byte[] ReadAllBytes(string path, FileReadRules rules)
    {
        using var file = OpenRead(path, rules);
        return file.ReadAllBytes();
    }

    /// <summary>True when <paramref name="path"/> names a regular file (links followed); nothing is opened.</summary>
    public static bool IsRegularFile(string path)
    {
        if (!Posix.Available) return File.Exists(path);
        try
        {
            var real = PhysicalPath.Resolve(Path.GetFullPath(path), out var exists);
            return exists && Posix.StatPath(real, out var type, out _) == 0 && type == Posix.TypeRegular;
        }
        catch (EngineException)
        {
            return false;
        }
    }

    /// <summary>True when <paramref name="path"/> itself is a symbolic link (not followed).</summary>
    public static bool IsLink(string path)
    {
        try
        {
            return new FileInfo(path).LinkTarget is not null;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException)
        {
            return false;
        }
    }

    /// <summary>
    /// Writes <paramref name="path"/> atomically: a new temporary file beside it (created exclusively, so never
    /// through a link), flushed, then renamed over the target. A reader sees the old content or the new.
    /// </summary>
    public static void WriteAtomic(string path, Action<Stream> write, string? display = null)
    {
        display ??= path;
        string full, dir, temp;
        try
        {
            full = Path.GetFullPath(path);
            dir = Path.GetDirectoryName(full) ?? ".";
            Directory.CreateDirectory(dir);
            temp = Path.Combine(dir, "." + Path.GetFileName(full) + "." + Guid.NewGuid().ToString("N") + ".tmp");
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw WriteError(display, e);
        }
        if (Directory.Exists(full) && !IsLink(full))
            throw new EngineException(ErrorCodes.FileWrite, "cannot write the file: a folder is in the way", display, 0, 0);
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, 1 << 16))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }
            // rename(2) replaces a link at the target with the new file; it never writes into what the link names.
            File.Move(temp, full, overwrite: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException)
        {
            TryDelete(temp);
            throw WriteError(display, e);
        }
        catch
        {
            TryDelete(temp);
            throw;
        }
    }

    /// <summary>The <c>E-FILE-WRITE</c> error for a failed write of <paramref name="display"/>.</summary>
    public static EngineException WriteError(string display, Exception e) =>
        new(ErrorCodes.FileWrite, "cannot write the file: " + Reason(e), display, 0, 0);

    private static string FullPath(string path, string display)
    {
        try
        {
            if (path.Contains('\0', StringComparison.Ordinal)) throw new ArgumentException("the path holds a NUL character");
            // Combined, not folded: a ".." must be resolved physically, after the links before it.
            return Path.IsPathFullyQualified(path) ? path : Path.Combine(Directory.GetCurrentDirectory(), path);
        }
        catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
        {
            throw new EngineException(ErrorCodes.FileRead, "not a valid path: " + e.Message, display, 0, 0);
        }
    }

    private static EngineException Outside(FileReadRules rules, string full, string real)
    {
        var rootShown = rules.RootDisplay ?? rules.Root!;
        var via = string.Equals(real, full, StringComparison.Ordinal) ? "" : $" (through a symbolic link to '{real}')";
        var hint = rules.OutsideHint.Length > 0 ? "; " + rules.OutsideHint : "";
        return new EngineException(ErrorCodes.PathOutsideRoot, $"the path leads outside '{rootShown}'{via}{hint}", rules.Display, 0, 0);
    }

    private static EngineException NotRegular(string display, int type) =>
        new(ErrorCodes.PathOutsideRoot, "not a regular file: it is " + Posix.TypeName(type) + "; only regular files are read", display, 0, 0);

    private static EngineException TooLarge(FileReadRules rules, long size) =>
        new(rules.SizeCode, string.Create(CultureInfo.InvariantCulture,
            $"the file has {size} bytes, more than the limit of {rules.MaxBytes}") + (rules.SizeHint.Length > 0 ? " (" + rules.SizeHint + ")" : ""),
            rules.Display, 0, 0);

    private static OpenedFile OpenPosix(string real, FileReadRules rules)
    {
        var display = rules.Display;
        // Refuse before opening where we can (opening some devices has effects), then check again on the handle.
        var pre = Posix.StatPath(real, out var preType, out _);
        if (pre == 0 && preType != Posix.TypeRegular) throw NotRegular(display, preType);
        var fd = Posix.Open(real, out var errno);
        if (fd < 0)
        {
            throw errno switch
            {
                2 => new EngineException(ErrorCodes.FileNotFound, "no such file", display, 0, 0),
                13 or 1 => new EngineException(ErrorCodes.FileRead, "cannot read the file: permission denied", display, 0, 0),
                40 => new EngineException(ErrorCodes.PathOutsideRoot, "too many symbolic links while resolving the path (a link loop?)", display, 0, 0),
                _ => new EngineException(ErrorCodes.FileRead, "cannot read the file: error " + errno.ToString(CultureInfo.InvariantCulture), display, 0, 0),
            };
        }
        var handle = new SafeFileHandle(fd, ownsHandle: true);
        try
        {
            if (Posix.StatHandle(fd, out var type, out var size) != 0)
                throw new EngineException(ErrorCodes.FileRead, "cannot read the file: its status is unavailable", display, 0, 0);
            if (type != Posix.TypeRegular) throw NotRegular(display, type);
            var reopen = "/proc/self/fd/" + fd.ToString(CultureInfo.InvariantCulture);
            // The kernel's own name for what we opened: a link swapped in after the resolution shows here.
            var opened = new FileInfo(reopen).LinkTarget;
            if (opened is not null && !string.Equals(opened, real, StringComparison.Ordinal))
                throw new EngineException(ErrorCodes.PathOutsideRoot, "the path changed while it was being opened", display, 0, 0);
            if (size > rules.MaxBytes) throw TooLarge(rules, size);
            return new OpenedFile(handle, real, size, opened is null ? real : reopen);
        }
        catch
        {
            handle.Dispose();
            throw;
        }
    }

    private static OpenedFile OpenPortable(string real, FileReadRules rules)
    {
        var display = rules.Display;
        if (Directory.Exists(real)) throw NotRegular(display, Posix.TypeDirectory);
        SafeFileHandle handle;
        try
        {
            handle = File.OpenHandle(real, FileMode.Open, FileAccess.Read, FileShare.Read);
        }
        catch (Exception e) when (e is FileNotFoundException or DirectoryNotFoundException)
        {
            throw new EngineException(ErrorCodes.FileNotFound, "no such file", display, 0, 0);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException)
        {
            throw new EngineException(ErrorCodes.FileRead, "cannot read the file: " + Reason(e), display, 0, 0);
        }
        try
        {
            var size = RandomAccess.GetLength(handle);
            if (size > rules.MaxBytes) throw TooLarge(rules, size);
            return new OpenedFile(handle, real, size, real);
        }
        catch
        {
            handle.Dispose();
            throw;
        }
    }

    private static string Reason(Exception e) => e switch
    {
        UnauthorizedAccessException => "permission denied",
        PathTooLongException => "the name is too long for the file system",
        DirectoryNotFoundException => "a folder on the way does not exist",
        IOException io when (io.HResult & 0xFFFF) == 28 => "no space left on the device",
        IOException io when (io.HResult & 0xFFFF) == 30 => "the file system is read-only",
        _ => e.Message,
    };

    private static void TryDelete(string path)
    {
        try { File.Delete(path); }
        catch (IOException) { }
        catch (UnauthorizedAccessException) { }
    }
}
