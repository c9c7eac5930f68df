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
    /// library. The loader now walks the footer with its own bounds-checked Thrift reader first and rejects this
    /// one at once; the time budget on opening stays as the backstop. Run as a child process, so a regression to
    /// the budget path cannot leave a spinning thread in the test process. parquet-footer-stop.parquet (input
    /// #13541 of the same fuzzer) is well-formed but for the footer's last byte, 0x10 where STOP (0x00) belongs
    /// (Thrift compact protocol: STOP is one zero byte); Parquet.Net loops on that too. parquet-page-header.parquet
    /// (input #41086) has a sound footer, but the first page header of column 1 is garbage; Parquet.Net's read of
    /// it spun for over a minute allocating gigabytes. The loader walks every chunk's page headers first.
    /// parquet-footer-types.parquet (input #65163) is well-formed Thrift whose column chunk fields have other
    /// types than parquet.thrift gives them; the footer walk checks the types of the fields Parquet.Net reads.
    /// </summary>
    [Theory]
    [InlineData("parquet-footer-hang.parquet", "the footer is not well-formed")]
    [InlineData("parquet-footer-stop.parquet", "the footer is not well-formed")]
    [InlineData("parquet-page-header.parquet", "column 'sailing_id': corrupt Thrift data")]
    [InlineData("parquet-footer-types.parquet", "the footer is not well-formed: corrupt Thrift data: ColumnChunk field 1 has type 6")]
    public void A_corrupted_parquet_file_ends_in_a_located_error(string name, string message)
    {
        using var box = new CliSandbox();
        File.Copy(Case(name), box.PathOf("hang.parquet"));
        var clock = Stopwatch.StartNew();
        var (exit, _, err) = box.Child(new Dictionary<string, string> { ["PARITY_PARQUET_OPEN_SECONDS"] = "2" }, "inspect", "hang.parquet");
        Assert.Equal(2, exit);
        Assert.Contains("hang.parquet", err, StringComparison.Ordinal);
        Assert.Contains("error " + ErrorCodes.Parquet + ": " + message, err, StringComparison.Ordinal);
        Assert.True(clock.Elapsed < TimeSpan.FromSeconds(30), "took " + clock.Elapsed.TotalSeconds + " s");
    }
}
