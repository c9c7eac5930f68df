using Parity.Benchmarks.Data;
using Parity.Engine.Columns;
using Parity.Engine.Memory;
using Parity.Engine.Modes;

namespace Parity.Benchmarks.Quick.Ratios;

/// <summary>Bytes held for 5,000,000 strings of exactly 20 ASCII characters: boxed over Arrow (not a time).</summary>
public sealed class StringBytesRatio : Ratio
{
    private double _value;

    public override string Name => "bytes.boxed_over_arrow";

    public override double Target => 2.9;

    public override string Description => "boxed bytes / arrow bytes (ColumnMemory)";

    public override double? Direct => _value;

    public override void Setup()
    {
        var strings = BenchData.Strings(StringKernelRatio.Rows, 20, 20, 0, seed: 11);
        var boxed = ColumnMemory.Bytes(BenchData.Boxed(strings, MissingMarker.Null));
        var arrow = ColumnMemory.Bytes(BenchData.Arrow(strings, MissingMarker.Null));
        _value = (double)boxed / arrow;
    }

    public override void Numerator()
    {
    }

    public override void Denominator()
    {
    }
}
