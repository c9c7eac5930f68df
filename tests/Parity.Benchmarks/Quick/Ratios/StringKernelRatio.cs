using Parity.Benchmarks.Data;
using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Benchmarks.Quick.Ratios;

/// <summary>
/// A string kernel on 5,000,000 strings of 10-30 bytes with 5% missing, boxed storage over Arrow storage.
/// Both sides use the null marker so only the storage differs.
/// </summary>
public sealed class StringKernelRatio : Ratio
{
    private static readonly Mode BoxedMode = Mode.Parse("boxed+null+cow");
    private static readonly Mode ArrowMode = Mode.Parse("arrow+null+cow");
    private readonly string _name;
    private readonly double _target;
    private readonly Func<Column, Mode, Column> _kernel;
    private ObjectColumn? _boxed;
    private Utf8Column? _arrow;

    public StringKernelRatio(string name, double target, Func<Column, Mode, Column> kernel)
    {
        _name = name;
        _target = target;
        _kernel = kernel;
    }

    public static int Rows { get; set; } = 5_000_000;

    public override string Name => _name;

    public override double Target => _target;

    public override string Description => "boxed ms / arrow ms";

    public override void Setup()
    {
        var strings = BenchData.Strings(Rows, 10, 30, 0.05, seed: 7);
        _boxed = BenchData.Boxed(strings, MissingMarker.Null);
        _arrow = BenchData.Arrow(strings, MissingMarker.Null);
    }

    public override void Verify()
    {
        var a = _kernel(_boxed!, BoxedMode);
        var b = _kernel(_arrow!, ArrowMode);
        for (var i = 0; i < a.Length; i += 997)
        {
            if (!a.GetValue(i).Equals(b.GetValue(i)))
                throw new InvalidOperationException($"{_name}: storages disagree at row {i}: {a.GetValue(i)} vs {b.GetValue(i)}");
        }
    }

    public override void Numerator() => _kernel(_boxed!, BoxedMode);

    public override void Denominator() => _kernel(_arrow!, ArrowMode);

    public override void Cleanup()
    {
        _boxed = null;
        _arrow = null;
    }
}
