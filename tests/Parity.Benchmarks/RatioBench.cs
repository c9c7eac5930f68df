using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Engines;
using Parity.Benchmarks.Quick;

namespace Parity.Benchmarks;

/// <summary>
/// The two sides of one quick-mode ratio under BenchmarkDotNet: the same data, the same code and the same
/// check that both sides agree, so the two modes cannot drift apart. Each side runs for hundreds of
/// milliseconds to seconds, so one invocation per iteration (the monitoring strategy) and a few iterations.
/// </summary>
[MemoryDiagnoser]
[SimpleJob(RunStrategy.Monitoring, launchCount: 1, warmupCount: 1, iterationCount: 5)]
public abstract class RatioBench
{
    protected Ratio Ratio { get; private set; } = null!;

    /// <summary>The quick-mode ratio name this benchmark runs.</summary>
    protected abstract string RatioName { get; }

    [GlobalSetup]
    public void Setup()
    {
        Ratio = RatioCatalog.All().Single(r => r.Name == RatioName);
        Ratio.Setup();
        Ratio.Verify();
    }

    [GlobalCleanup]
    public void Cleanup() => Ratio.Cleanup();
}
