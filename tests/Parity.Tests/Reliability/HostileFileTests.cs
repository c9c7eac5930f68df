using System.Diagnostics;
using System.Text;

namespace Parity.Tests.Reliability;

/// <summary>
/// The file-access attacks of docs/reliability.md ("Threat model"), each rebuilt in a temporary folder: links
/// that lead a check one way and the open another, files that are not regular files, links in the golden
/// store, link loops and folder links while collecting scripts, raw names on the terminal, scripts that are
/// not UTF-8. Each ends with exit 2 and a located message, and no secret reaches any output. The bombs run
/// as child processes under a GC heap cap (<c>DOTNET_GCHeapHardLimit</c>, 512 MiB), so runaway memory ends
/// the child instead of the machine.
/// </summary>
public sealed class HostileFileTests : IDisposable
{
    private const string Secret = "PARITY-SECRET-7f3e9c";
    private const string Csv = "ticket_id,passenger\n1,Åsa\n2,Νίκος\n";

    private static readonly Dictionary<string, string> Capped = new(StringComparer.Ordinal)
    {
        ["DOTNET_GCHeapHardLimit"] = "0x20000000",
        ["PARITY_PLANTED"] = Secret,
    };

    private readonly CliSandbox _box = new();

    public HostileFileTests()
    {
        _box.Write("outside/secret.csv", "ticket_id,passenger\n1," + Secret + "\n");
        _box.Write("outside/private.key", Secret + "\n");
        _box.Write("project/ferry/tickets.csv", Csv);
    }

    public void Dispose() => _box.Dispose();

    private string Project => _box.PathOf("project");

    private string Script(string text, string name = "ferry/load.parity")
    {
        var path = Path.Combine(Project, name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text, new UTF8Encoding(false));
        return name;
    }

    private (int Exit, string Out, string Err) Cli(params string[] args) => CliSandbox.CliIn(Project, args);

    private (int Exit, string Out, string Err) Child(params string[] args)
    {
        var info = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = Project,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            StandardOutputEncoding = Encoding.UTF8,
            StandardErrorEncoding = Encoding.UTF8,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(CliSandbox.ParityDll);
        foreach (var a in args) info.ArgumentList.Add(a);
        info.Environment["CI"] = "true";
        foreach (var (k, v) in Capped) info.Environment[k] = v;
        using var p = Process.Start(info)!;
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(TimeSpan.FromSeconds(60)))
        {
            p.Kill(entireProcessTree: true);
            Assert.Fail("parity " + string.Join(' ', args) + " did not finish within 60 s");
        }
        p.WaitForExit();
        return (p.ExitCode, stdout.Result, stderr.Result);
    }

    private static void AssertRefused((int Exit, string Out, string Err) r, string code, string located)
    {
        Assert.True(r.Exit == 2, "exit " + r.Exit + "\n" + r.Err);
        Assert.Contains(located, r.Err, StringComparison.Ordinal);
        Assert.Contains("error " + code + ":", r.Err, StringComparison.Ordinal);
        Assert.DoesNotContain(Secret, r.Out + r.Err, StringComparison.Ordinal);
        Assert.DoesNotContain("E-INTERNAL", r.Err, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", r.Err, StringComparison.Ordinal);
    }

    [Fact]
    public void A_dot_dot_after_a_folder_link_is_resolved_where_the_link_leads()
    {
        // ferry/out -> ../../outside/.. (a folder outside), then 'out/../outside/secret.csv' climbs from there.
        Directory.CreateSymbolicLink(Path.Combine(Project, "ferry", "out"), _box.PathOf("outside"));
        File.CreateSymbolicLink(Path.Combine(Project, "ferry", "innocent.csv"), "out/../outside/secret.csv");
        var name = Script("load t from 'innocent.csv'\ncheck t\n");
        AssertRefused(Cli("show", name, "--checkpoint", "t"), "E-PATH", "ferry/load.parity:1:13:");
        name = Script("load t from 'out/../outside/secret.csv'\ncheck t\n");
        AssertRefused(Cli("show", name, "--checkpoint", "t"), "E-PATH", "ferry/load.parity:1:13:");
        AssertRefused(Cli("run", name), "E-PATH", "ferry/load.parity:1:13:");
    }

    [Fact]
    public void The_environment_of_the_process_is_never_read_through_proc()
    {
        // The attack of the report: a link to /proc/self/task and 't/../environ' (which the OS resolves to /proc/PID/environ).
        if (!OperatingSystem.IsLinux()) return;
        Directory.CreateSymbolicLink(Path.Combine(Project, "ferry", "t"), "/proc/self/task");
        var name = Script("load e from 't/../environ' as csv\ncheck e\n");
        AssertRefused(Child("show", name, "--checkpoint", "e"), "E-PATH", "ferry/load.parity:1:13:");
    }

    [Fact]
    public void A_fifo_a_device_and_a_folder_as_data_are_refused_at_once()
    {
        if (!OperatingSystem.IsLinux()) return;
        var fifo = Path.Combine(Project, "ferry", "pipe.csv");
        using (var mk = Process.Start("mkfifo", [fifo])!)
        {
            mk.WaitForExit();
            Assert.Equal(0, mk.ExitCode);
        }
        var name = Script("load t from 'pipe.csv'\ncheck t\n");
        var r = Child("show", name, "--checkpoint", "t");
        AssertRefused(r, "E-PATH", "ferry/load.parity:1:13:");
        Assert.Contains("named pipe", r.Err, StringComparison.Ordinal);

        File.CreateSymbolicLink(Path.Combine(Project, "ferry", "random.csv"), "/dev/urandom");
        name = Script("load t from 'random.csv'\ncheck t\n");
        // Allowed outside the root on purpose: the regular-file rule refuses it on its own.
        r = Child("show", name, "--checkpoint", "t", "--allow-outside-root");
        AssertRefused(r, "E-PATH", "ferry/load.parity:1:13:");
        Assert.Contains("character device", r.Err, StringComparison.Ordinal);

        Directory.CreateDirectory(Path.Combine(Project, "ferry", "folder.csv"));
        name = Script("load t from 'folder.csv'\ncheck t\n");
        AssertRefused(Cli("show", name, "--checkpoint", "t"), "E-PATH", "ferry/load.parity:1:13:");
    }

    [Fact]
    public void A_link_loop_is_a_located_path_error()
    {
        File.CreateSymbolicLink(Path.Combine(Project, "ferry", "a.csv"), "b.csv");
        File.CreateSymbolicLink(Path.Combine(Project, "ferry", "b.csv"), "a.csv");
        Directory.CreateSymbolicLink(Path.Combine(Project, "ferry", "self"), "self");
        foreach (var load in new[] { "a.csv", "self/x.csv" })
        {
            var name = Script("load t from '" + load + "'\ncheck t\n");
            var r = Cli("show", name, "--checkpoint", "t");
            AssertRefused(r, "E-PATH", "ferry/load.parity:1:13:");
            Assert.Contains("symbolic links", r.Err, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Accept_of_one_checkpoint_never_copies_what_a_golden_link_names()
    {
        var name = Script("load t from 'tickets.csv'\ncheck t\ncheck t as 'again'\n");
        Assert.Equal(0, Cli("accept", name).Exit);
        var folder = Directory.GetDirectories(Path.Combine(Project, "golden"))[0];
        var planted = Path.Combine(folder, "modern", "stolen.frame.txt");
        File.CreateSymbolicLink(planted, _box.PathOf("outside/private.key"));
        var r = Cli("accept", name, "--checkpoint", "t");
        AssertRefused(r, "E-GOLDEN", "stolen.frame.txt");
        Assert.True(new FileInfo(planted).LinkTarget is not null, "the link stays a link");
        foreach (var f in Directory.EnumerateFiles(Path.Combine(Project, "golden"), "*", SearchOption.AllDirectories))
            if (new FileInfo(f).LinkTarget is null)
                Assert.DoesNotContain(Secret, File.ReadAllText(f), StringComparison.Ordinal);
        // A full accept drops the link and writes regular files only.
        Assert.Equal(0, Cli("accept", name).Exit);
        Assert.False(File.Exists(planted) || new FileInfo(planted).LinkTarget is not null);
    }

    [Fact]
    public void A_golden_file_linked_to_a_device_or_outside_is_refused_without_reading_it()
    {
        if (!OperatingSystem.IsLinux()) return;
        var name = Script("load t from 'tickets.csv'\ncheck t\n");
        Assert.Equal(0, Cli("accept", name).Exit);
        var folder = Directory.GetDirectories(Path.Combine(Project, "golden"))[0];
        var frame = Directory.GetFiles(Path.Combine(folder, "modern"), "*.frame.txt")[0];
        File.Delete(frame);
        File.CreateSymbolicLink(frame, "/dev/zero");
        var r = Child("check", name);
        AssertRefused(r, "E-PATH", Path.GetFileName(frame));
        File.Delete(frame);
        File.CreateSymbolicLink(frame, _box.PathOf("outside/private.key"));
        AssertRefused(Child("check", name), "E-PATH", Path.GetFileName(frame));
    }

    [Fact]
    public void Collecting_scripts_ends_on_folder_links_and_refuses_linked_scripts_outside()
    {
        Script("load t from '../ferry/tickets.csv'\ncheck t\n", "suite/one.parity");
        Directory.CreateSymbolicLink(Path.Combine(Project, "suite", "loopdir"), ".");
        Directory.CreateSymbolicLink(Path.Combine(Project, "suite", "updir"), "..");
        Directory.CreateSymbolicLink(Path.Combine(Project, "suite", "rootdir"), "/");
        var r = Cli("run", "suite");
        Assert.True(r.Exit is 0 or 1, r.Err);
        Assert.Equal("", r.Err);

        File.CreateSymbolicLink(Path.Combine(Project, "suite", "stolen.parity"), _box.PathOf("outside/private.key"));
        r = Cli("run", "suite");
        AssertRefused(r, "E-PATH", "suite/stolen.parity:");
    }

    [Fact]
    public void A_script_that_is_a_device_is_refused_and_one_that_is_not_utf8_is_located()
    {
        if (OperatingSystem.IsLinux())
        {
            File.CreateSymbolicLink(Path.Combine(Project, "zero.parity"), "/dev/zero");
            AssertRefused(Child("run", "zero.parity"), "E-PATH", "zero.parity:");
        }
        File.WriteAllBytes(Path.Combine(Project, "bad.parity"), [.. "load t from 'ferry/tickets.csv'\ncheck t \xE9"u8.ToArray(), 0xC3, 0x28, .. "\n"u8.ToArray()]);
        var r = Cli("run", "bad.parity");
        AssertRefused(r, "E-UTF8", "bad.parity:2:10:");
        r = Cli("show", "bad.parity", "--checkpoint", "t");
        AssertRefused(r, "E-UTF8", "bad.parity:2:10:");
    }

    [Fact]
    public void Names_with_control_characters_are_escaped_in_diagnostics()
    {
        var dir = "ferry/\u001b[2J\u001b]0;owned\u0007";
        var name = Script("load t from 'missing.csv'\ncheck t\n", dir + "/x.parity");
        var r = Cli("run", name);
        Assert.Equal(2, r.Exit);
        Assert.DoesNotContain('\u001b', r.Err);
        Assert.DoesNotContain('\u0007', r.Err);
        Assert.Contains("\\x1B[2J", r.Err, StringComparison.Ordinal);
        name = Script("load t from 'a\u001b[2J.csv'\ncheck t\n");
        r = Cli("run", name);
        Assert.Equal(2, r.Exit);
        Assert.DoesNotContain('\u001b', r.Err);
    }
}
