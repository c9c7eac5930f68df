namespace Parity.Benchmarks.Quick.Ratios;

/// <summary>
/// Spec §2.2: the row-preserving chain (rename, add, select, cast to the same type, take of every row, column)
/// on 3,000,000 rows and 20 columns, alias (eager defensive copies) over cow (O(columns)). Reuses
/// <see cref="ReshapeBench"/>'s frame and script; the interpreter runs over frames already loaded.
/// </summary>
public sealed class ReshapeRatio : Ratio
{
    private ReshapeBench? _bench;

    public override string Name => "reshape.alias_over_cow";

    public override double Target => 200;

    public override string Description => "alias ms / cow ms";

    public override int Repetitions => 3;

    public override void Setup()
    {
        _bench = new ReshapeBench { Rows = 3_000_000 };
        _bench.Setup();
    }

    public override void Verify()
    {
        if (_bench!.Alias() != _bench.Rows || _bench.Cow() != _bench.Rows)
            throw new InvalidOperationException("reshape: a mode lost rows");
    }

    public override void Numerator() => _bench!.Alias();

    public override void Denominator() => _bench!.Cow();

    public override void Cleanup() => _bench = null;
}
