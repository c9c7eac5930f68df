using System.Diagnostics;
using Parity.Harness.Fixtures;
using Parity.Harness.Golden;

namespace Parity.Tests.Reliability;

/// <summary>
/// Golden store safety across real processes (spec §5: "Writes are atomic"): two accepts at once leave a
/// consistent store, a competing accept fails with E-GOLDEN-LOCK, and an accept killed at random points
/// (fixed seed) leaves the previous snapshot or the new one, never a mix. The in-process versions of these
/// checks (hooks between renames, a held lock, tampered files) live in Harness/GoldenStoreTests.
/// </summary>
public sealed class GoldenProcessTests : IDisposable
{
    private const string Script = """
        load tickets from '../harbor/tickets.csv'
        load sailings from '../harbor/sailings.parquet'
        let joined = tickets join sailings on sailing_id left
        check joined
        let adults = tickets where age >= 18 order by fare desc
        check adults
        let per_sailing = tickets group by sailing_id compute sold = count(), takings = sum(fare)
        check per_sailing
        set tickets.note = 'refund' where fare < 0
        check tickets as 'after refunds'
        """;

    private readonly CliSandbox _box = new();

    public GoldenProcessTests()
    {
        _box.Write("scripts/big.parity", Script);
    }

    public void Dispose() => _box.Dispose();

    private void Data(int seed, int rows) => new HarborLineGenerator(seed).Write(_box.PathOf("harbor"), rows);

    private static readonly string[] AcceptArgs = ["accept", "scripts/big.parity", "--golden", "golden", "--row-limit", "100"];

    [Fact]
    public void A_second_accept_process_while_the_lock_is_held_fails_with_a_clear_message()
    {
        Data(1, 300);
        Directory.CreateDirectory(_box.PathOf("golden"));
        using (GoldenLock.Acquire(_box.PathOf("golden"), "golden"))
        {
            var (exit, _, err) = _box.Child(null, AcceptArgs);
            Assert.Equal(2, exit);
            Assert.Contains("golden/.lock", err, StringComparison.Ordinal);
            Assert.Contains("E-GOLDEN-LOCK", err, StringComparison.Ordinal);
            Assert.Contains("another `parity accept`", err, StringComparison.Ordinal);
        }
        Assert.Equal(0, _box.Child(null, AcceptArgs).Exit); // the lock goes with its holder
    }

    [Fact]
    public async Task Two_accept_processes_at_once_leave_a_consistent_store()
    {
        Data(2, 8_000);
        for (var round = 0; round < 2; round++)
        {
            using var a = _box.Start(null, AcceptArgs);
            using var b = _box.Start(null, AcceptArgs);
            foreach (var p in new[] { a, b })
            {
                var err = p.StandardError.ReadToEndAsync();
                _ = p.StandardOutput.ReadToEndAsync();
                Assert.True(p.WaitForExit(TimeSpan.FromMinutes(2)), "accept did not finish");
                p.WaitForExit();
                // Either it accepted, or it lost the race for the lock and said so.
                var text = await err;
                Assert.True(p.ExitCode == 0 || (p.ExitCode == 2 && text.Contains("E-GOLDEN-LOCK", StringComparison.Ordinal)), text);
            }
            Assert.True(a.ExitCode == 0 || b.ExitCode == 0, "at least one accept succeeds");
            var check = _box.Cli("check", "scripts/big.parity", "--golden", "golden", "--row-limit", "100");
            Assert.True(check.Exit == 0, check.Out + check.Err);
        }
    }

    [Fact]
    public void An_accept_killed_at_random_points_leaves_the_old_or_the_new_snapshot()
    {
        // Snapshot A, accepted in-process; snapshot B, for other data, accepted into a second store.
        Data(3, 8_000);
        Assert.Equal(0, _box.Cli(AcceptArgs).Exit);
        var old = _box.Files("golden");
        Data(4, 8_000);
        Assert.Equal(0, _box.Cli(["accept", "scripts/big.parity", "--golden", "golden-new", "--row-limit", "100"]).Exit);
        var fresh = _box.Files("golden-new");
        Assert.NotEmpty(old);
        Assert.NotEmpty(fresh);
        Assert.NotEqual(Content(old), Content(fresh)); // and differ

        // How long a whole accept takes in a child, so kill points spread over it.
        var clock = Stopwatch.StartNew();
        var warm = _box.Child(null, ["accept", "scripts/big.parity", "--golden", "golden-timing", "--row-limit", "100"]);
        Assert.Equal(0, warm.Exit);
        var full = clock.Elapsed.TotalMilliseconds;

        var random = new Random(1701);
        var outcomes = new List<string>();
        for (var k = 0; k < 4; k++)
        {
            ResetGolden(old);
            var delay = (int)(full * (0.3 + 0.7 * random.NextDouble()));
            using (var p = _box.Start(null, AcceptArgs))
            {
                _ = p.StandardOutput.ReadToEndAsync();
                _ = p.StandardError.ReadToEndAsync();
                if (!p.WaitForExit(delay)) p.Kill(entireProcessTree: true);
                p.WaitForExit();
            }
            var now = Readable(_box.Files("golden"));
            var which = Content(now) == Content(Strip(old)) ? "old" : Content(now) == Content(Strip(fresh)) ? "new" : null;
            Assert.True(which is not null, "after a kill at " + delay + " ms the store is a mix: " + Keys(now));
            outcomes.Add(which!);
            // The data on disk is B: a check passes exactly when the store holds the new snapshot,
            // and reading the store never fails (no half-written or corrupted file).
            var check = _box.Cli("check", "scripts/big.parity", "--golden", "golden", "--row-limit", "100");
            Assert.True(check.Exit == (which == "new" ? 0 : 1), which + ": " + check.Out + check.Err);
        }
        // A later accept recovers whatever a kill left behind.
        Assert.Equal(0, _box.Cli(AcceptArgs).Exit);
        Assert.Equal(Content(Strip(fresh)), Content(Readable(_box.Files("golden"))));
        Assert.NotEmpty(outcomes);
    }

    private void ResetGolden(SortedDictionary<string, byte[]> files)
    {
        var dir = _box.PathOf("golden");
        if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        foreach (var (rel, bytes) in files)
        {
            var path = Path.Combine(dir, rel);
            Directory.CreateDirectory(Path.GetDirectoryName(path)!);
            File.WriteAllBytes(path, bytes);
        }
    }

    /// <summary>
    /// What a reader sees: the script folder, or (when a kill fell between the two renames of the swap) the
    /// set-aside folder; staging folders, temporary dot-files and the lock file are not part of a snapshot.
    /// </summary>
    private static SortedDictionary<string, byte[]> Readable(SortedDictionary<string, byte[]> files)
    {
        var folders = new HashSet<string>(StringComparer.Ordinal);
        foreach (var k in files.Keys) folders.Add(k.Split('/')[0]);
        var result = new SortedDictionary<string, byte[]>(StringComparer.Ordinal);
        foreach (var (k, v) in files)
        {
            var parts = k.Split('/');
            var top = parts[0];
            if (Path.GetFileName(k).StartsWith('.') || top.EndsWith("~~accept-new", StringComparison.Ordinal)) continue;
            if (top.EndsWith("~~accept-old", StringComparison.Ordinal))
            {
                var live = top[..^"~~accept-old".Length];
                if (folders.Contains(live)) continue;
                top = live;
            }
            result[top + "/" + string.Join('/', parts[1..])] = v;
        }
        return result;
    }

    private static SortedDictionary<string, byte[]> Strip(SortedDictionary<string, byte[]> files) => Readable(files);

    private static string Keys(SortedDictionary<string, byte[]> files) => string.Join(",", files.Keys);

    private static string Content(SortedDictionary<string, byte[]> files)
    {
        var sb = new System.Text.StringBuilder();
        foreach (var (k, v) in files) sb.Append(k).Append('=').Append(Convert.ToHexString(System.Security.Cryptography.SHA256.HashData(v))).Append(';');
        return sb.ToString();
    }
}
