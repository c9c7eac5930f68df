using System.Diagnostics;
using System.Globalization;
using Parity.Engine.Errors;
using Parity.Engine.Files;

namespace Parity.Tests.Reliability;

/// <summary>
/// Fuzzes <see cref="PhysicalPath.Resolve(string, out bool)"/> over random trees of folders, files and links
/// (relative and absolute, links to links, to folders outside the tree, with <c>..</c>, and loops) against an
/// independent model of physical resolution (POSIX path_resolution(7): each component from the left, a link
/// replaced by its target at once, <c>..</c> taken from the folder reached, at most 40 links per resolution),
/// and where the OS can tell, against the OS itself (does the path exist; which file does an open reach).
/// Quick mode: 60 trees of 40 queries; <c>PARITY_FUZZ_SECONDS=N</c> runs longer.
/// </summary>
public sealed class PhysicalPathFuzzTests : IDisposable
{
    private static readonly string[] Names = ["a", "b", "c", "d"];
    private readonly string _base;

    public PhysicalPathFuzzTests()
    {
        _base = Path.Combine(Path.GetTempPath(), "parity-paths-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(_base);
    }

    public void Dispose()
    {
        try { Directory.Delete(_base, recursive: true); }
        catch (IOException) { }
    }

    /// <summary>The model: what each path in the tree is.</summary>
    private sealed class Model
    {
        public readonly HashSet<string> Dirs = new(StringComparer.Ordinal);
        public readonly HashSet<string> Files = new(StringComparer.Ordinal);
        public readonly Dictionary<string, string> Links = new(StringComparer.Ordinal);
        public required string Base;

        /// <summary>Folders above the tree exist (they hold no links: the test's temp folder is checked for that).</summary>
        public bool IsDir(string p) => Dirs.Contains(p) || (Base.StartsWith(p, StringComparison.Ordinal) && (p == "/" || Base.Length == p.Length || Base[p.Length] == '/'));
    }

    private sealed class LoopException : Exception
    {
    }

    /// <summary>
    /// Independent resolution: recursive on the text of the path. A link's target replaces the walked prefix
    /// and the link, and the whole path is walked again (the prefix is real, so walking it again follows nothing).
    /// </summary>
    private static (string Real, bool Exists) ModelResolve(Model m, string path, ref int budget)
    {
        var parts = path.Split('/');
        var cur = "/";
        var exists = true;
        for (var i = 0; i < parts.Length; i++)
        {
            var c = parts[i];
            if (c.Length == 0 || c == ".") continue;
            if (c == "..")
            {
                var cut = cur.LastIndexOf('/');
                cur = cut <= 0 ? "/" : cur[..cut];
                continue;
            }
            var next = cur == "/" ? "/" + c : cur + "/" + c;
            if (!exists) { cur = next; continue; }
            if (m.Links.TryGetValue(next, out var target))
            {
                if (--budget < 0) throw new LoopException();
                var rest = string.Join('/', parts[(i + 1)..]);
                var start = target.StartsWith('/') ? target : cur + "/" + target;
                return ModelResolve(m, start + "/" + rest, ref budget);
            }
            cur = next;
            var more = false;
            for (var k = i + 1; k < parts.Length; k++) more |= parts[k].Length > 0;
            if (m.IsDir(next)) continue;
            if (m.Files.Contains(next) && !more) continue;
            exists = false;
        }
        return (cur, exists);
    }

    [Fact]
    public void Physical_resolution_matches_the_model_and_the_os()
    {
        if (!OperatingSystem.IsLinux()) return;
        // The model assumes no link above the tree.
        Assert.Equal(_base, PhysicalPath.Resolve(_base));
        var rng = new Random(4242);
        var clock = Stopwatch.StartNew();
        int trees = 0, queries = 0, loops = 0, missing = 0, found = 0;
        while (Fuzz.More(trees, 60, clock))
        {
            var root = Path.Combine(_base, "t" + trees.ToString(CultureInfo.InvariantCulture));
            var model = Build(rng, root);
            for (var q = 0; q < 40; q++)
            {
                var query = Query(rng, root);
                queries++;
                var budget = PhysicalPath.MaxLinks;
                (string Real, bool Exists)? expected;
                try
                {
                    expected = ModelResolve(model, query, ref budget);
                }
                catch (LoopException)
                {
                    expected = null;
                }
                string real;
                bool exists;
                try
                {
                    real = PhysicalPath.Resolve(query, out exists);
                }
                catch (EngineException e)
                {
                    Assert.Equal(ErrorCodes.PathOutsideRoot, e.Code);
                    Assert.True(expected is null, "loop reported for " + query + "; model: " + expected);
                    Assert.Equal(40, OsOpen(query, out _)); // ELOOP from the kernel too
                    loops++;
                    continue;
                }
                Assert.True(expected is not null, "model sees a loop in " + query + "; got " + real);
                Assert.Equal(expected.Value.Exists, exists);
                if (exists) Assert.Equal(expected.Value.Real, real);
                // The kernel agrees (open(2) on the path as written, no folding by .NET): it opens exactly
                // when the path exists, and what it opened is the resolved file.
                var errno = OsOpen(query, out var opened);
                Assert.True((errno == 0) == exists, "OS (errno " + errno + ") and resolution disagree on " + query + " -> " + real);
                if (exists) Assert.Equal(real, opened);
                if (exists) found++;
                else missing++;
            }
            trees++;
        }
        Console.WriteLine($"paths: {trees} trees, {queries} queries: {found} found, {missing} missing, {loops} loops");
        Assert.True(loops > 0 && found > 0 && missing > 0, "the generator covers loops, hits and misses");
    }

    /// <summary>open(2) the path as written; 0 and the kernel's name for the opened file, or errno.</summary>
    private static int OsOpen(string path, out string? opened)
    {
        opened = null;
        var fd = Parity.Engine.Files.Internal.Posix.Open(path, out var errno);
        if (fd < 0) return errno;
        using var handle = new Microsoft.Win32.SafeHandles.SafeFileHandle(fd, ownsHandle: true);
        opened = new FileInfo("/proc/self/fd/" + fd.ToString(CultureInfo.InvariantCulture)).LinkTarget;
        return 0;
    }

    private static Model Build(Random rng, string root)
    {
        var outside = root + "-outside";
        var model = new Model { Base = Path.GetDirectoryName(root)! };
        foreach (var top in new[] { root, outside })
        {
            Directory.CreateDirectory(top);
            model.Dirs.Add(top);
        }
        var folders = new List<string> { root, outside };
        for (var i = 0; i < 6; i++)
        {
            var parent = folders[rng.Next(folders.Count)];
            var p = parent + "/" + Names[rng.Next(Names.Length)];
            if (model.Dirs.Contains(p) || model.Files.Contains(p) || model.Links.ContainsKey(p)) continue;
            Directory.CreateDirectory(p);
            model.Dirs.Add(p);
            folders.Add(p);
        }
        for (var i = 0; i < 5; i++)
        {
            var p = folders[rng.Next(folders.Count)] + "/f" + Names[rng.Next(Names.Length)];
            if (model.Files.Contains(p)) continue;
            File.WriteAllText(p, "x");
            model.Files.Add(p);
        }
        for (var i = 0; i < 8; i++)
        {
            var at = folders[rng.Next(folders.Count)];
            var p = at + "/l" + Names[rng.Next(Names.Length)];
            if (model.Links.ContainsKey(p)) continue;
            string target = rng.Next(6) switch
            {
                0 => "..",
                1 => ".",
                2 => folders[rng.Next(folders.Count)],                        // absolute, maybe outside
                3 => "../" + Names[rng.Next(Names.Length)] + "/../l" + Names[rng.Next(Names.Length)], // through links and ..
                4 => "l" + Names[rng.Next(Names.Length)],                         // a link to a link (or itself)
                _ => Names[rng.Next(Names.Length)] + "/f" + Names[rng.Next(Names.Length)],
            };
            File.CreateSymbolicLink(p, target);
            model.Links[p] = target;
        }
        return model;
    }

    private static string Query(Random rng, string root)
    {
        var n = 1 + rng.Next(6);
        var parts = new List<string>();
        for (var i = 0; i < n; i++)
        {
            parts.Add(rng.Next(8) switch
            {
                0 => "..",
                1 => ".",
                2 or 3 => "l" + Names[rng.Next(Names.Length)],
                4 => "f" + Names[rng.Next(Names.Length)],
                _ => Names[rng.Next(Names.Length)],
            });
        }
        return root + "/" + string.Join('/', parts);
    }
}
