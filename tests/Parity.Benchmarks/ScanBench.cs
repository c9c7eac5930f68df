using BenchmarkDotNet.Attributes;

namespace Parity.Benchmarks;

/// <summary>
/// The Arrow string kernels on 5,000,000 strings against a plain vectorised sum over the same Arrow buffers
/// (reading the memory once).
/// </summary>
public class ScanBench : RatioBench
{
    [Params("length", "contains")]
    public string Kernel { get; set; } = "length";

    protected override string RatioName => Kernel + ".scan_over_arrow";

    [Benchmark(Baseline = true)]
    public void PlainScan() => Ratio.Numerator();

    [Benchmark]
    public void ArrowKernel() => Ratio.Denominator();
}
