using System.Text;

namespace Parity.Tests.Engine.IO;

/// <summary>A temporary directory per test, and the repository's fixture folder.</summary>
internal sealed class TestFiles : IDisposable
{
    public TestFiles()
    {
        Dir = Path.Combine(Path.GetTempPath(), "parity-io-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Dir);
    }

    public string Dir { get; }

    public string Write(string name, string text, bool bom = false)
    {
        var path = Path.Combine(Dir, name);
        File.WriteAllBytes(path, [.. (bom ? "\uFEFF"u8.ToArray() : []), .. Encoding.UTF8.GetBytes(text)]);
        return path;
    }

    public string WriteBytes(string name, byte[] bytes)
    {
        var path = Path.Combine(Dir, name);
        File.WriteAllBytes(path, bytes);
        return path;
    }

    public string PathOf(string name) => Path.Combine(Dir, name);

    public void Dispose()
    {
        try
        {
            Directory.Delete(Dir, recursive: true);
        }
        catch (IOException)
        {
            // A mapped Arrow file may still be open on some platforms; the OS temp cleaner gets it.
        }
    }

    /// <summary>The repository root (the folder holding Parity.sln).</summary>
    public static string RepoRoot
    {
        get
        {
            var dir = new DirectoryInfo(AppContext.BaseDirectory);
            while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "Parity.sln"))) dir = dir.Parent;
            return dir?.FullName ?? throw new InvalidOperationException("Parity.sln not found above the test binaries");
        }
    }

    public static string Fixture(string relative) => Path.Combine(RepoRoot, "fixtures", relative);
}
