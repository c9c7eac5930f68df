using System.Diagnostics;
using System.Text;
using Parity.Cli;

namespace Parity.Tests.Reliability;

/// <summary>A temporary project folder, the CLI run in-process in it, and the built <c>parity</c> run as a child process.</summary>
internal sealed class CliSandbox : IDisposable
{
    public CliSandbox()
    {
        // Resolved through any link in the temp path, so paths printed by the CLI compare as written.
        Root = Path.Combine(Path.GetTempPath(), "parity-rel-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Root);
    }

    public string Root { get; }

    /// <summary>The built CLI beside the test binaries (the test project references Parity.Cli).</summary>
    public static string ParityDll => Path.Combine(AppContext.BaseDirectory, "parity.dll");

    public string PathOf(string relative) => Path.Combine(Root, relative);

    public string Write(string relative, string text)
    {
        var path = PathOf(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text, new UTF8Encoding(false));
        return path;
    }

    public (int Exit, string Out, string Err) Cli(params string[] args) => CliIn(Root, args);

    public static (int Exit, string Out, string Err) CliIn(string dir, params string[] args)
    {
        var o = new StringWriter();
        var e = new StringWriter();
        var exit = CliApp.Run(args, new CliContext(o, e, dir));
        return (exit, o.ToString(), e.ToString());
    }

    /// <summary>Starts <c>dotnet parity.dll ARGS</c> in <see cref="Root"/> with extra environment variables.</summary>
    public Process Start(IReadOnlyDictionary<string, string>? env, params string[] args)
    {
        var info = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = Root,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            StandardOutputEncoding = Encoding.UTF8,
            StandardErrorEncoding = Encoding.UTF8,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(ParityDll);
        foreach (var a in args) info.ArgumentList.Add(a);
        info.Environment["CI"] = "true";
        if (env is not null)
            foreach (var (k, v) in env) info.Environment[k] = v;
        return Process.Start(info) ?? throw new InvalidOperationException("could not start dotnet");
    }

    /// <summary>Runs the child to the end (two minutes at most) and returns its exit code and output.</summary>
    public (int Exit, string Out, string Err) Child(IReadOnlyDictionary<string, string>? env, params string[] args)
    {
        using var p = Start(env, args);
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(TimeSpan.FromMinutes(2)))
        {
            p.Kill(entireProcessTree: true);
            Assert.Fail("parity " + string.Join(' ', args) + " did not finish within two minutes");
        }
        p.WaitForExit();
        return (p.ExitCode, stdout.Result, stderr.Result);
    }

    /// <summary>Every file under <paramref name="relative"/> (relative path to bytes), sorted.</summary>
    public SortedDictionary<string, byte[]> Files(string relative)
    {
        var result = new SortedDictionary<string, byte[]>(StringComparer.Ordinal);
        var dir = PathOf(relative);
        if (!Directory.Exists(dir)) return result;
        foreach (var path in Directory.EnumerateFiles(dir, "*", SearchOption.AllDirectories))
            result[Path.GetRelativePath(dir, path).Replace('\\', '/')] = File.ReadAllBytes(path);
        return result;
    }

    public static void CopyDirectory(string from, string to)
    {
        Directory.CreateDirectory(to);
        foreach (var file in Directory.EnumerateFiles(from, "*", SearchOption.AllDirectories))
        {
            var target = Path.Combine(to, Path.GetRelativePath(from, file));
            Directory.CreateDirectory(Path.GetDirectoryName(target)!);
            File.Copy(file, target, overwrite: true);
        }
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
            // A killed child may still hold a file for a moment; the OS temp cleaner gets it.
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
