using System.Text;
using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Engines;
using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Benchmarks;

/// <summary>
/// 5,000,000 strings of exactly 20 ASCII characters decoded from one UTF-8 buffer into each storage. The
/// allocated bytes (MemoryDiagnoser, counted by the runtime) cross-check the bytes ratio of the quick mode, which
/// comes from our own accounting (ColumnMemory): boxed is a string object per cell plus the reference array,
/// Arrow is the data, offsets and validity buffers.
/// </summary>
[MemoryDiagnoser]
[SimpleJob(RunStrategy.Monitoring, launchCount: 1, warmupCount: 1, iterationCount: 5)]
public class StringBytesBench
{
    private const int Rows = 5_000_000;
    private const int Width = 20;
    private byte[] _utf8 = [];

    [GlobalSetup]
    public void Setup()
    {
        var strings = Data.BenchData.Strings(Rows, Width, Width, 0, seed: 11);
        _utf8 = new byte[Rows * Width];
        for (var i = 0; i < Rows; i++) Encoding.UTF8.GetBytes(strings[i]!, _utf8.AsSpan(i * Width));
    }

    [Benchmark(Baseline = true)]
    public Column Boxed()
    {
        var cells = new object?[Rows];
        for (var i = 0; i < Rows; i++) cells[i] = Encoding.UTF8.GetString(_utf8, i * Width, Width);
        return new ObjectColumn(cells, MissingMarker.Null);
    }

    [Benchmark]
    public Column Arrow()
    {
        var b = new Utf8ColumnBuilder(Rows, Rows * Width);
        for (var i = 0; i < Rows; i++) b.Append(_utf8.AsSpan(i * Width, Width));
        return b.Build(MissingMarker.Null);
    }
}
