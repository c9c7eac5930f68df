using BenchmarkDotNet.Attributes;

namespace Parity.Benchmarks;

/// <summary>Two equal 10,000,000 x 10 frames: the mode differ against a plain scan of the same bytes.</summary>
public class DiffBench : RatioBench
{
    protected override string RatioName => "diff.scan_over_diff";

    [Benchmark(Baseline = true)]
    public void PlainScan() => Ratio.Numerator();

    [Benchmark]
    public void Differ() => Ratio.Denominator();
}
