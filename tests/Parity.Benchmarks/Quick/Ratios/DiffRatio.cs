using System.Globalization;
using System.Runtime.InteropServices;
using Parity.Benchmarks.Data;
using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Script.Running;

namespace Parity.Benchmarks.Quick.Ratios;

/// <summary>
/// Two equal 10,000,000 x 10 frames (4 int64, 4 float64 with some nulls, 2 Arrow strings; the second frame
/// a deep copy, so nothing is shared): a plain vectorised scan of every buffer of both frames over the
/// differ's comparison of the two checkpoints. How close the differ comes to reading the bytes once.
/// </summary>
public sealed class DiffRatio : Ratio
{
    private const int Rows = 10_000_000;
    private ModeRun? _a;
    private ModeRun? _b;

    public override string Name => "diff.scan_over_diff";

    public override double Target => 0.33;

    public override string Description => "scan ms / diff ms";

    public override int Repetitions => 5;

    public static long Sink { get; private set; }

    public override void Setup()
    {
        var rng = new Random(29);
        var names = new string[10];
        var columns = new Column[10];
        for (var c = 0; c < 8; c++)
        {
            names[c] = "c" + c.ToString(CultureInfo.InvariantCulture);
            if (c < 4)
            {
                var d = new long[Rows];
                for (var i = 0; i < Rows; i++) d[i] = rng.NextInt64(-1_000_000, 1_000_000);
                columns[c] = new Int64Column(d, MissingMarker.Null);
            }
            else
            {
                var d = new double[Rows];
                var bits = c == 4 ? new byte[(Rows + 7) >> 3] : null;
                for (var i = 0; i < Rows; i++)
                {
                    d[i] = rng.NextDouble() * 1000;
                    if (bits is not null && rng.Next(20) != 0) bits[i >> 3] |= (byte)(1 << (i & 7));
                }
                columns[c] = new Float64Column(d, bits is null ? Validity.AllValid(Rows) : new Validity(bits, 0, Rows), MissingMarker.Null);
            }
        }
        names[8] = "s0";
        names[9] = "s1";
        var strings = BenchData.Strings(Rows, 8, 24, 0.02, seed: 31);
        columns[8] = BenchData.Arrow(strings, MissingMarker.Null);
        strings = null;
        columns[9] = columns[8].Slice(0, Rows).Clone();
        var copies = new Column[10];
        for (var c = 0; c < 10; c++) copies[c] = columns[c].Clone();
        _a = Run(new Table(names, columns, Rows));
        _b = Run(new Table(names, copies, Rows));
    }

    private static ModeRun Run(Table table)
    {
        var run = new ModeRun(Mode.Modern, "diff.parity");
        run.Checkpoints.Add(new CheckpointResult("big", "big", 1, 1, table));
        return run;
    }

    public override void Verify()
    {
        var findings = ModeDiffer.Compare(_a!, _b!, "diff.parity", DiffOptions.Default);
        if (findings.Count != 0) throw new InvalidOperationException("diff: equal frames gave " + findings.Count.ToString(CultureInfo.InvariantCulture) + " findings");
    }

    public override void Numerator() => Sink = Scan(_a!.Checkpoints[0].Table) + Scan(_b!.Checkpoints[0].Table);

    public override void Denominator() => ModeDiffer.Compare(_a!, _b!, "diff.parity", DiffOptions.Default);

    private static long Scan(Table t)
    {
        long sum = 0;
        foreach (var c in t.Columns)
        {
            switch (c)
            {
                case PrimitiveColumn<long> p:
                    sum += ScanOverKernelRatio.SumWords(MemoryMarshal.AsBytes(p.Span)) + ScanOverKernelRatio.SumWords(p.Validity.Bits.Span);
                    break;
                case PrimitiveColumn<double> p:
                    sum += ScanOverKernelRatio.SumWords(MemoryMarshal.AsBytes(p.Span)) + ScanOverKernelRatio.SumWords(p.Validity.Bits.Span);
                    break;
                case Utf8Column u:
                    sum += ScanOverKernelRatio.Scan(u);
                    break;
            }
        }
        return sum;
    }

    public override void Cleanup()
    {
        _a = null;
        _b = null;
    }
}
