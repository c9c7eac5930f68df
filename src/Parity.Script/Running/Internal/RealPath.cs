namespace Parity.Script.Running.Internal;

/// <summary>
/// The final path of a file with every symbolic link on the way resolved (links in folders too), so the
/// root check of a <c>load</c> sees where the bytes really are. Parts that do not exist are kept as written.
/// </summary>
internal static class RealPath
{
    private const int MaxLinks = 40;

    public static string Resolve(string fullPath)
    {
        var root = Path.GetPathRoot(fullPath) ?? "";
        var parts = fullPath[root.Length..].Split(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar);
        var current = root;
        var links = 0;
        for (var i = 0; i < parts.Length; i++)
        {
            if (parts[i].Length == 0) continue;
            var next = Path.Combine(current, parts[i]);
            FileSystemInfo info = Directory.Exists(next) ? new DirectoryInfo(next) : new FileInfo(next);
            if (info.Exists && info.LinkTarget is not null && links++ < MaxLinks)
            {
                var target = info.ResolveLinkTarget(returnFinalTarget: true);
                if (target is not null)
                {
                    // The target may itself sit below linked folders: resolve it again, then go on.
                    current = Resolve(Path.GetFullPath(target.FullName));
                    continue;
                }
            }
            current = next;
        }
        return current;
    }
}
