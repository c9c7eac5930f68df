using BenchmarkDotNet.Attributes;

namespace Parity.Benchmarks;

/// <summary>
/// The Harbor Line demo fixtures at 1,000,000 tickets: loading them against a whole run of the demo script in
/// both presets with every report.
/// </summary>
public class EndToEndBench : RatioBench
{
    protected override string RatioName => "e2e.load_over_run";

    [Benchmark(Baseline = true)]
    public void LoadFixtures() => Ratio.Numerator();

    [Benchmark]
    public void RunBothPresets() => Ratio.Denominator();
}
