using Parity.Harness.Golden;

namespace Parity.Tests.Harness;

/// <summary>Golden folders whose script is gone: found under the checked folders only, pruned atomically.</summary>
public sealed class StaleGoldenTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-stale-" + Guid.NewGuid().ToString("N"));

    public StaleGoldenTests() => Directory.CreateDirectory(_dir);

    public void Dispose()
    {
        if (Directory.Exists(_dir)) Directory.Delete(_dir, recursive: true);
    }

    private GoldenStore Store() => new(Path.Combine(_dir, "golden"), "golden");

    private void Folder(string script)
    {
        var dir = Path.Combine(_dir, "golden", GoldenNames.ScriptFolder(script));
        Directory.CreateDirectory(Path.Combine(dir, "legacy"));
        File.WriteAllText(Path.Combine(dir, "findings.txt"), "x\n");
    }

    [Theory]
    [InlineData("ferry/refunds.parity")]
    [InlineData("ferry/ünï code/a b.parity")]
    [InlineData("top.parity")]
    [InlineData("a~b/.hidden.parity")]
    public void Folder_names_decode_back_to_their_script(string script)
    {
        Assert.Equal(script, GoldenNames.TryScriptOfFolder(GoldenNames.ScriptFolder(script)));
    }

    [Theory]
    [InlineData("ferry~refunds~~accept-new")]
    [InlineData("bad%zz")]
    [InlineData("lower%c3%a9")]
    public void Names_the_store_never_writes_decode_to_nothing(string folder)
    {
        Assert.Null(GoldenNames.TryScriptOfFolder(folder));
    }

    [Fact]
    public void Only_folders_under_a_checked_folder_are_stale()
    {
        Folder("ferry/refunds.parity");
        Folder("ferry/deleted.parity");
        Folder("ferry/deep/gone.parity");
        Folder("other/kept.parity");
        var store = Store();
        Assert.Equal(["ferry/deep/gone.parity", "ferry/deleted.parity"], store.FindStale(["ferry"], ["ferry/refunds.parity"]));
        Assert.Empty(store.FindStale([], ["ferry/refunds.parity"]));                     // scripts given by path only
        Assert.Equal(["ferry/deep/gone.parity", "ferry/deleted.parity", "other/kept.parity"], store.FindStale(["."], ["ferry/refunds.parity"]));
        Assert.Contains("`parity accept --prune`", store.StaleMismatch("ferry/deleted.parity").Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Prune_removes_the_folder_and_a_killed_prune_leaves_nothing_readable()
    {
        Folder("ferry/deleted.parity");
        Folder("ferry/other.parity");
        var store = Store();
        store.BetweenRenames = () => throw new IOException("killed");
        Assert.Throws<IOException>(() => store.Prune("ferry/deleted.parity"));
        // After the rename the folder is gone as a whole: nothing stale is reported, the other folder is intact.
        Assert.False(store.Exists("ferry/deleted.parity"));
        Assert.Empty(store.FindStale(["ferry"], ["ferry/other.parity"]));
        store.BetweenRenames = null;
        store.Prune("ferry/other.parity");
        Assert.Empty(Directory.GetDirectories(Path.Combine(_dir, "golden")));            // the leftover went too
    }
}
