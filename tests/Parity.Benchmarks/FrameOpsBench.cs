using BenchmarkDotNet.Attributes;

namespace Parity.Benchmarks;

/// <summary>
/// filter, group-sum, sort and inner join on 5,000,000 rows (int64 key with 1,000 values, double value, one
/// string column): Microsoft.Data.Analysis's DataFrame against Parity's engine in <c>modern</c> mode.
/// </summary>
public class FrameOpsBench : RatioBench
{
    [Params("filter", "groupsum", "sort", "join")]
    public string Operation { get; set; } = "filter";

    protected override string RatioName => Operation + ".mda_over_parity";

    [Benchmark(Baseline = true)]
    public void MicrosoftDataAnalysis() => Ratio.Numerator();

    [Benchmark]
    public void Parity() => Ratio.Denominator();
}
