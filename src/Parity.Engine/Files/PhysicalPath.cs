using Parity.Engine.Errors;

namespace Parity.Engine.Files;

/// <summary>
/// Where a path really leads, resolved the way the operating system walks it (docs/reliability.md, "Paths"):
/// component by component from the root, each symbolic link replaced by its target as soon as it is met, and
/// a <c>..</c> taken from the folder reached so far, never folded away in the text first. (Folding first is
/// wrong: for <c>dir/../x</c> where <c>dir</c> links elsewhere, the OS opens <c>x</c> beside the link's
/// target, not beside the link.) At most <see cref="MaxLinks"/> links are followed in one resolution, as
/// Linux does (ELOOP); more is a loop and an <c>E-PATH</c> error.
/// </summary>
public static class PhysicalPath
{
    /// <summary>Linux's limit on links followed in one path resolution (path_resolution(7)).</summary>
    public const int MaxLinks = 40;

    /// <summary>The real path of the absolute <paramref name="path"/>; parts that do not exist are kept as written.</summary>
    public static string Resolve(string path) => Resolve(path, out _);

    /// <summary>
    /// As <see cref="Resolve(string)"/>; <paramref name="exists"/> is false when a component is missing or is not
    /// a folder but has more components after it (the OS would fail there: what follows is then folded lexically).
    /// Throws <see cref="EngineException"/> <c>E-PATH</c> for a link loop.
    /// </summary>
    public static string Resolve(string path, out bool exists)
    {
        if (!Path.IsPathFullyQualified(path)) throw new ArgumentException("an absolute path is required", nameof(path));
        var root = Path.GetPathRoot(path)!;
        var pending = new Stack<string>();
        PushParts(pending, path[root.Length..]);
        var current = new List<string>();
        var links = 0;
        exists = true;
        while (pending.Count > 0)
        {
            var part = pending.Pop();
            if (part.Length == 0 || part == ".") continue;
            if (part == "..")
            {
                // The folder reached so far is already real, so its parent is the physical parent.
                if (current.Count > 0) current.RemoveAt(current.Count - 1);
                continue;
            }
            if (!exists)
            {
                current.Add(part);
                continue;
            }
            var candidate = Join(root, current, part);
            var target = LinkTargetOf(candidate);
            if (target is null)
            {
                current.Add(part);
                // A missing component, or a file with more components after it, ends the physical walk.
                if (pending.Count > 0 ? !Directory.Exists(candidate) : !Path.Exists(candidate)) exists = false;
                continue;
            }
            if (++links > MaxLinks)
                throw new EngineException(ErrorCodes.PathOutsideRoot,
                    $"too many symbolic links while resolving the path (more than {MaxLinks}; a link loop?) at '{candidate}'");
            if (Path.IsPathRooted(target))
            {
                var targetRoot = Path.GetPathRoot(target);
                if (!string.IsNullOrEmpty(targetRoot))
                {
                    root = Path.IsPathFullyQualified(target) ? targetRoot : root;
                    current.Clear();
                    target = target[targetRoot.Length..];
                }
            }
            PushParts(pending, target);
        }
        return Join(root, current, null);
    }

    /// <summary>True when <paramref name="realPath"/> is <paramref name="realRoot"/> or below it (both real paths).</summary>
    public static bool IsInside(string realPath, string realRoot)
    {
        var comparison = OperatingSystem.IsWindows() ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;
        var trimmed = Path.TrimEndingDirectorySeparator(realRoot);
        if (string.Equals(Path.TrimEndingDirectorySeparator(realPath), trimmed, comparison)) return true;
        var withSep = Path.EndsInDirectorySeparator(trimmed) ? trimmed : trimmed + Path.DirectorySeparatorChar;
        return realPath.StartsWith(withSep, comparison);
    }

    private static string? LinkTargetOf(string path)
    {
        try
        {
            return new FileInfo(path).LinkTarget;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            return null;
        }
    }

    private static void PushParts(Stack<string> pending, string text)
    {
        var parts = text.Split(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar);
        for (var i = parts.Length - 1; i >= 0; i--) pending.Push(parts[i]);
    }

    private static string Join(string root, List<string> parts, string? last)
    {
        var sb = new System.Text.StringBuilder(root);
        var sep = Path.DirectorySeparatorChar;
        foreach (var p in parts)
        {
            if (sb.Length > 0 && sb[^1] != sep && sb[^1] != Path.AltDirectorySeparatorChar) sb.Append(sep);
            sb.Append(p);
        }
        if (last is not null)
        {
            if (sb.Length > 0 && sb[^1] != sep && sb[^1] != Path.AltDirectorySeparatorChar) sb.Append(sep);
            sb.Append(last);
        }
        return sb.ToString();
    }
}
