namespace Parity.Harness.Running;

/// <summary>Turns the <c>SCRIPT|DIR...</c> arguments into script paths.</summary>
public static class ScriptFiles
{
    /// <summary>
    /// Each argument is a script file or a folder; a folder stands for every <c>*.parity</c> file below it,
    /// sorted ordinally by path relative to the working directory. Duplicates are dropped (first wins). An
    /// argument that does not exist, or a folder without scripts, goes to <paramref name="errors"/> as a
    /// located message.
    /// </summary>
    public static IReadOnlyList<string> Resolve(IEnumerable<string> arguments, string workingDirectory, List<string> errors)
    {
        var result = new List<string>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var arg in arguments)
        {
            var full = Path.GetFullPath(arg, workingDirectory);
            if (File.Exists(full))
            {
                if (seen.Add(full)) result.Add(full);
                continue;
            }
            if (!Directory.Exists(full))
            {
                errors.Add(arg + ": error " + Engine.Errors.ErrorCodes.FileNotFound + ": no such script or folder");
                continue;
            }
            var found = new List<string>();
            foreach (var f in Directory.EnumerateFiles(full, "*.parity", SearchOption.AllDirectories)) found.Add(f);
            found.Sort((a, b) => string.CompareOrdinal(Relative(a, workingDirectory), Relative(b, workingDirectory)));
            if (found.Count == 0) errors.Add(arg + ": error " + Engine.Errors.ErrorCodes.FileNotFound + ": no .parity scripts in this folder");
            foreach (var f in found)
                if (seen.Add(f)) result.Add(f);
        }
        return result;
    }

    /// <summary>The path relative to the working directory with forward slashes: the script's name in findings and the golden store.</summary>
    public static string Relative(string fullPath, string workingDirectory) =>
        Path.GetRelativePath(workingDirectory, fullPath).Replace('\\', '/');
}
