using BenchmarkDotNet.Attributes;
using Parity.Benchmarks.Data;
using Parity.Engine.Columns;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Benchmarks;

/// <summary>
/// The string kernels on 1,000,000 strings of 10-30 ASCII bytes with 5% missing, per storage (both with the
/// null marker, so only the storage differs): length, contains and equals with a literal, upper.
/// </summary>
[MemoryDiagnoser]
public class StringKernelBench
{
    private Column _column = null!;
    private Mode _mode;

    [Params("boxed", "arrow")]
    public string Storage { get; set; } = "arrow";

    [GlobalSetup]
    public void Setup()
    {
        var strings = BenchData.Strings(1_000_000, 10, 30, 0.05, seed: 7);
        _mode = Mode.Parse(Storage + "+null+cow");
        _column = Storage == "boxed" ? BenchData.Boxed(strings, MissingMarker.Null) : BenchData.Arrow(strings, MissingMarker.Null);
    }

    [Benchmark]
    public Column Length() => StringKernels.Length(_column, _mode);

    [Benchmark]
    public Column Contains() => StringKernels.Match(StringPredicate.Contains, _column, Value.Of("xyz"), _mode);

    [Benchmark]
    public Column EqualsLiteral() => Comparison.Compare(ComparisonOp.Equal, _column, Value.Of("abcdefghijklmno"), _mode);

    [Benchmark]
    public Column Upper() => StringKernels.Upper(_column, _mode);
}
