using Parity.Engine.Errors;
using Parity.Engine.Files;
using Parity.Engine.Text;

namespace Parity.Harness.Running;

/// <summary>Turns the <c>SCRIPT|DIR...</c> arguments into script paths.</summary>
public static class ScriptFiles
{
    /// <summary>
    /// Each argument is a script file, a folder or a glob (<c>*</c>, <c>?</c>, <c>**</c>; docs/workflow.md); a folder stands for every <c>*.parity</c> file below it,
    /// sorted ordinally by path relative to the working directory. Duplicates are dropped (first wins). An
    /// argument that does not exist, or a folder without scripts, goes to <paramref name="errors"/> as a
    /// located message.
    /// <para>
    /// Walking a folder follows the rules of docs/reliability.md ("Paths"): a linked folder is entered only
    /// when its real path lies inside the real path of the folder being walked and was not entered before
    /// (so <c>loop -&gt; .</c>, <c>up -&gt; ..</c> or a link to <c>/</c> end the walk there); a linked script
    /// whose real path lies outside that folder, or a <c>.parity</c> entry that is not a regular file, is an
    /// <c>E-PATH</c> error.
    /// </para>
    /// </summary>
    public static IReadOnlyList<string> Resolve(IEnumerable<string> arguments, string workingDirectory, List<string> errors)
    {
        var result = new List<string>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var arg in arguments)
        {
            var full = Path.GetFullPath(arg, workingDirectory);
            if (Project.Internal.Glob.HasWildcard(arg))
            {
                var matched = ExpandGlob(full.Replace('\\', '/'), workingDirectory, errors);
                matched.Sort((a, b) => string.CompareOrdinal(Relative(a, workingDirectory), Relative(b, workingDirectory)));
                if (matched.Count == 0) errors.Add(ControlEscape.Escape(arg) + ": error " + ErrorCodes.FileNotFound + ": no .parity scripts match this pattern");
                foreach (var f in matched)
                    if (seen.Add(f)) result.Add(f);
                continue;
            }
            if (File.Exists(full))
            {
                if (seen.Add(full)) result.Add(full);
                continue;
            }
            if (!Directory.Exists(full))
            {
                errors.Add(ControlEscape.Escape(arg) + ": error " + ErrorCodes.FileNotFound + ": no such script or folder");
                continue;
            }
            var found = new List<string>();
            string realTop;
            try
            {
                realTop = PhysicalPath.Resolve(full);
            }
            catch (EngineException e)
            {
                errors.Add(ControlEscape.Escape(arg) + ": error " + e.Code + ": " + ControlEscape.Escape(e.Message));
                continue;
            }
            var visited = new HashSet<string>(StringComparer.Ordinal) { realTop };
            Walk(full, realTop, visited, found, workingDirectory, errors);
            found.Sort((a, b) => string.CompareOrdinal(Relative(a, workingDirectory), Relative(b, workingDirectory)));
            if (found.Count == 0) errors.Add(ControlEscape.Escape(arg) + ": error " + ErrorCodes.FileNotFound + ": no .parity scripts in this folder");
            foreach (var f in found)
                if (seen.Add(f)) result.Add(f);
        }
        return result;
    }

    private static void Walk(string dir, string realTop, HashSet<string> visited, List<string> found, string workingDirectory, List<string> errors)
    {
        FileSystemInfo[] entries;
        try
        {
            entries = new DirectoryInfo(dir).GetFileSystemInfos();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            errors.Add(Shown(dir, workingDirectory) + ": error " + ErrorCodes.FileRead + ": cannot list the folder");
            return;
        }
        Array.Sort(entries, (a, b) => string.CompareOrdinal(a.Name, b.Name));
        foreach (var entry in entries)
        {
            var path = entry.FullName;
            var isLink = entry.LinkTarget is not null;
            var isScript = path.EndsWith(".parity", StringComparison.Ordinal);
            if (!isLink && entry is DirectoryInfo)
            {
                Walk(path, realTop, visited, found, workingDirectory, errors);
                continue;
            }
            if (!isLink && !isScript) continue;
            string real;
            var exists = true;
            try
            {
                real = isLink ? PhysicalPath.Resolve(path, out exists) : path;
            }
            catch (EngineException e)
            {
                if (isScript) errors.Add(Shown(path, workingDirectory) + ": error " + e.Code + ": " + ControlEscape.Escape(e.Message));
                continue;
            }
            if (!exists) continue;
            if (Directory.Exists(real))
            {
                // A linked folder: entered once, and only when it stays inside the folder being walked.
                if (PhysicalPath.IsInside(real, realTop) && visited.Add(real)) Walk(path, realTop, visited, found, workingDirectory, errors);
                continue;
            }
            if (!isScript) continue;
            if (isLink && !PhysicalPath.IsInside(real, realTop))
            {
                errors.Add(Shown(path, workingDirectory) + ": error " + ErrorCodes.PathOutsideRoot
                    + ": a symbolic link to a file outside the folder being collected; name the script itself to run it");
                continue;
            }
            if (!SafeFile.IsRegularFile(real))
            {
                errors.Add(Shown(path, workingDirectory) + ": error " + ErrorCodes.PathOutsideRoot + ": not a regular file; only regular files are read");
                continue;
            }
            found.Add(path);
        }
    }

    private static string Shown(string path, string workingDirectory) => ControlEscape.Escape(Relative(path, workingDirectory));

    /// <summary>
    /// The <c>*.parity</c> files a glob (a full path with <c>*</c>, <c>?</c>, <c>**</c>) matches: the folder
    /// before the first wildcard is searched, and each file's path below it is matched against the rest.
    /// </summary>
    private static List<string> ExpandGlob(string pattern, string workingDirectory, List<string> errors)
    {
        var matched = new List<string>();
        var wild = pattern.AsSpan().IndexOfAny('*', '?');
        var slash = pattern.LastIndexOf('/', wild);
        var baseDir = slash <= 0 ? "/" : pattern[..slash];
        var rest = pattern[(slash + 1)..];
        if (!Directory.Exists(baseDir)) return matched;
        string realTop;
        try
        {
            realTop = PhysicalPath.Resolve(baseDir);
        }
        catch (EngineException e)
        {
            errors.Add(Shown(baseDir, workingDirectory) + ": error " + e.Code + ": " + ControlEscape.Escape(e.Message));
            return matched;
        }
        // The folder is walked by the same rules as a folder argument; the glob then picks among its scripts.
        var found = new List<string>();
        Walk(baseDir, realTop, new HashSet<string>(StringComparer.Ordinal) { realTop }, found, workingDirectory, errors);
        foreach (var f in found)
            if (Project.Internal.Glob.IsMatch(rest, Path.GetRelativePath(baseDir, f).Replace('\\', '/'))) matched.Add(f);
        return matched;
    }

    /// <summary>The path relative to the working directory with forward slashes: the script's name in findings and the golden store.</summary>
    public static string Relative(string fullPath, string workingDirectory) =>
        Path.GetRelativePath(workingDirectory, fullPath).Replace('\\', '/');
}
