using System.Diagnostics;
using Parity.Engine.Errors;
using Parity.Tests.Engine.IO;

namespace Parity.Tests.Reliability;

/// <summary>
/// Inputs found by the fuzzers that trip a dependency; each test checks that Parity still ends in a located
/// error (and guards the workaround against regression).
/// </summary>
public sealed class KnownIssueTests
{
    private static string Case(string name) => Path.Combine(TestFiles.RepoRoot, "tests", "Parity.Tests", "Reliability", "Cases", name);

    /// <summary>
    /// Parquet.Net 6.1.0 never returns from <c>ParquetReader.CreateAsync</c> on this mutated copy of
    /// fixtures/harbor/sailings.parquet (long-mode Parquet fuzzer, seed 7331, input #2573): the loop is inside the
    /// library. The loader opens Parquet files under a time budget, so the CLI still ends with a located
    /// E-PARQUET error and exit code 2. Run as a child process: the abandoned reader thread ends with it.
    /// </summary>
    [Fact]
    public void A_corrupted_parquet_footer_ends_in_a_located_error()
    {
        using var box = new CliSandbox();
        File.Copy(Case("parquet-footer-hang.parquet"), box.PathOf("hang.parquet"));
        var clock = Stopwatch.StartNew();
        var (exit, _, err) = box.Child(new Dictionary<string, string> { ["PARITY_PARQUET_OPEN_SECONDS"] = "2" }, "inspect", "hang.parquet");
        Assert.Equal(2, exit);
        Assert.Contains("hang.parquet", err, StringComparison.Ordinal);
        Assert.Contains("error " + ErrorCodes.Parquet + ":", err, StringComparison.Ordinal);
        Assert.True(clock.Elapsed < TimeSpan.FromSeconds(60), "took " + clock.Elapsed.TotalSeconds + " s");
    }
}
