using System.Numerics;
using System.Runtime.InteropServices;
using Parity.Benchmarks.Data;
using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Benchmarks.Quick.Ratios;

/// <summary>
/// A plain vectorised sum over the Arrow buffers (offsets, data, validity) over the time of the kernel on
/// the same column: how close the kernel comes to reading the memory once.
/// </summary>
public sealed class ScanOverKernelRatio : Ratio
{
    private static readonly Mode ArrowMode = Mode.Parse("arrow+null+cow");
    private readonly string _name;
    private readonly Func<Column, Mode, Column> _kernel;
    private Utf8Column? _arrow;

    public ScanOverKernelRatio(string name, Func<Column, Mode, Column> kernel)
    {
        _name = name;
        _kernel = kernel;
    }

    public override string Name => _name;

    public override double Target => 0.5;

    public override string Description => "scan ms / kernel ms";

    public static long Sink { get; private set; }

    public override void Setup() =>
        _arrow = BenchData.Arrow(BenchData.Strings(StringKernelRatio.Rows, 10, 30, 0.05, seed: 7), MissingMarker.Null);

    public override void Numerator() => Sink = Scan(_arrow!);

    public override void Denominator() => _kernel(_arrow!, ArrowMode);

    public override void Cleanup() => _arrow = null;

    /// <summary>Sums every 8-byte word of the three buffers with <see cref="Vector{T}"/>.</summary>
    public static long Scan(Utf8Column column)
    {
        var total = SumWords(column.Data) + SumWords(MemoryMarshal.AsBytes(column.Offsets));
        total += SumWords(column.Array.NullBitmapBuffer.Span);
        return total;
    }

    public static long SumWords(ReadOnlySpan<byte> bytes)
    {
        var words = MemoryMarshal.Cast<byte, ulong>(bytes);
        var acc = Vector<ulong>.Zero;
        var i = 0;
        for (; i + Vector<ulong>.Count <= words.Length; i += Vector<ulong>.Count)
            acc += new Vector<ulong>(words.Slice(i));
        var sum = Vector.Sum(acc);
        for (; i < words.Length; i++) sum += words[i];
        return (long)sum;
    }
}
