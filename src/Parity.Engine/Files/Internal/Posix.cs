using System.Runtime.InteropServices;

namespace Parity.Engine.Files.Internal;

/// <summary>
/// The few POSIX calls .NET does not expose: <c>open</c> with <c>O_NONBLOCK</c> (so opening a FIFO never
/// waits for a writer) and <c>statx</c> on an open descriptor (the type of what was really opened). Linux only;
/// <c>struct statx</c> has one layout on every Linux architecture, unlike <c>struct stat</c>.
/// </summary>
internal static unsafe partial class Posix
{
    public const int ORdOnly = 0;
    public const int ONoCtty = 0x100;
    public const int ONonBlock = 0x800;
    public const int OCloExec = 0x80000;
    private const int AtEmptyPath = 0x1000;
    private const int AtSymlinkNoFollow = 0x100;
    private const uint StatxType = 0x1;
    private const uint StatxSize = 0x200;

    public const int TypeMask = 0xF000;
    public const int TypeRegular = 0x8000;
    public const int TypeDirectory = 0x4000;
    public const int TypeFifo = 0x1000;
    public const int TypeCharDevice = 0x2000;
    public const int TypeBlockDevice = 0x6000;
    public const int TypeSocket = 0xC000;
    public const int TypeLink = 0xA000;

    [LibraryImport("libc", EntryPoint = "open", StringMarshalling = StringMarshalling.Utf8, SetLastError = true)]
    private static partial int OpenNative(string path, int flags);

    [LibraryImport("libc", EntryPoint = "statx", StringMarshalling = StringMarshalling.Utf8, SetLastError = true)]
    private static partial int StatxNative(int dirfd, string path, int flags, uint mask, byte* buffer);

    /// <summary>True where the calls above are available (Linux with glibc or musl).</summary>
    public static bool Available { get; } = Probe();

    private static bool Probe()
    {
        if (!OperatingSystem.IsLinux()) return false;
        try
        {
            return Stat(-100, "/", noFollow: true, out _, out _) == 0;
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
        {
            return false;
        }
    }

    /// <summary>Opens read-only, never blocking and never becoming the controlling terminal; -1 and errno on failure.</summary>
    public static int Open(string path, out int errno)
    {
        var fd = OpenNative(path, ORdOnly | ONonBlock | ONoCtty | OCloExec);
        errno = fd < 0 ? Marshal.GetLastPInvokeError() : 0;
        return fd;
    }

    /// <summary>The file type bits and size of an open descriptor (fstat through the handle).</summary>
    public static int StatHandle(int fd, out int type, out long size) => Stat(fd, "", noFollow: false, out type, out size, AtEmptyPath);

    /// <summary>The file type bits and size of a path, without following a final link (lstat).</summary>
    public static int StatPath(string path, out int type, out long size) => Stat(-100, path, noFollow: true, out type, out size);

    private static int Stat(int dirfd, string path, bool noFollow, out int type, out long size, int extra = 0)
    {
        var buffer = stackalloc byte[256];
        var flags = extra | (noFollow ? AtSymlinkNoFollow : 0);
        var rc = StatxNative(dirfd, path, flags, StatxType | StatxSize, buffer);
        if (rc != 0)
        {
            type = 0;
            size = 0;
            return Marshal.GetLastPInvokeError();
        }
        // struct statx: stx_mode is the u16 at byte 28, stx_size the u64 at byte 40 (linux/stat.h).
        type = *(ushort*)(buffer + 28) & TypeMask;
        size = (long)*(ulong*)(buffer + 40);
        return 0;
    }

    public static string TypeName(int type) => type switch
    {
        TypeDirectory => "a folder",
        TypeFifo => "a named pipe (FIFO)",
        TypeCharDevice => "a character device",
        TypeBlockDevice => "a block device",
        TypeSocket => "a socket",
        TypeLink => "a symbolic link",
        _ => "not a regular file",
    };
}
