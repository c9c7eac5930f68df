using Microsoft.Data.Analysis;
using Parity.Benchmarks.Data;
using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using Parity.Engine.Values;

namespace Parity.Benchmarks.Quick.Ratios;

/// <summary>
/// One operation on the same 5,000,000 rows (int64 key with 1,000 distinct values, double value, one string
/// column) in Microsoft.Data.Analysis's DataFrame over Parity's engine in <c>modern</c> mode, through the
/// engine's public operations. Results are checked equal before timing.
/// </summary>
public sealed class ReferenceFrameRatio : Ratio
{
    public const int Rows = 5_000_000;
    private const double Threshold = 500.0;
    private static readonly Mode ModeUsed = Mode.Modern;
    private readonly string _operation;
    private readonly double _target;
    private DataFrame? _df;
    private DataFrame? _dfRight;
    private Table? _table;
    private Table? _right;

    public ReferenceFrameRatio(string operation, double target)
    {
        _operation = operation;
        _target = target;
    }

    public override string Name => _operation + ".mda_over_parity";

    public override double Target => _target;

    public override string Description => "Microsoft.Data.Analysis ms / Parity ms";

    public override int Repetitions => _operation is "sort" or "join" ? 3 : 5;

    public override void Setup()
    {
        var rng = new Random(17);
        var keys = new long[Rows];
        var values = new double[Rows];
        for (var i = 0; i < Rows; i++)
        {
            keys[i] = rng.Next(1000);
            values[i] = rng.NextDouble() * 1000; // practically no ties, so any sort gives one order
        }
        var strings = BenchData.Strings(Rows, 10, 30, 0, seed: 23);
        _table = new Table(["key", "value", "name"],
            [new Int64Column(keys, MissingMarker.Null), new Float64Column(values, MissingMarker.Null), BenchData.Arrow(strings, MissingMarker.Null)], Rows);
        _df = new DataFrame(new PrimitiveDataFrameColumn<long>("key", keys), new PrimitiveDataFrameColumn<double>("value", values),
            new StringDataFrameColumn("name", strings));
        var rk = new long[1000];
        var rate = new double[1000];
        for (var i = 0; i < rk.Length; i++)
        {
            rk[i] = i;
            rate[i] = i * 0.25;
        }
        _right = new Table(["key", "rate"], [new Int64Column(rk, MissingMarker.Null), new Float64Column(rate, MissingMarker.Null)], rk.Length);
        _dfRight = new DataFrame(new PrimitiveDataFrameColumn<long>("key", rk), new PrimitiveDataFrameColumn<double>("rate", rate));
    }

    public override void Numerator() => RunReference();

    public override void Denominator() => RunParity();

    private object RunReference() => _operation switch
    {
        "filter" => _df!.Filter(_df["value"].ElementwiseGreaterThan(Threshold)),
        "groupsum" => _df!.GroupBy("key").Sum("value"),
        "sort" => _df!.OrderBy("value"),
        _ => _df!.Merge<long>(_dfRight!, "key", "key", joinAlgorithm: JoinAlgorithm.Inner),
    };

    private Table RunParity()
    {
        var t = _table!;
        switch (_operation)
        {
            case "filter":
            {
                var condition = Comparison.Compare(ComparisonOp.Greater, t["value"], Value.Of(Threshold), ModeUsed);
                return TableOps.Filter(t, Masks.Select(condition, ModeUsed, out _));
            }
            case "groupsum":
            {
                var groups = Grouping.Group(t, ["key"]);
                var sums = Aggregation.Aggregate(AggregateFunction.Sum, t["value"], groups, ModeUsed);
                return new Table(["key", "value"], [t["key"].Gather(groups.Representative), sums], groups.GroupCount);
            }
            case "sort":
                return TableOps.Gather(t, Sorting.Permutation(t, [new SortKey("value", false)]), ModeUsed);
            default:
                return Joining.Join(t, _right!, "key", "key", leftOuter: false, ModeUsed, long.MaxValue);
        }
    }

    public override void Verify()
    {
        var reference = (DataFrame)RunReference();
        var parity = RunParity();
        if (reference.Rows.Count != parity.RowCount)
            throw new InvalidOperationException($"{Name}: {reference.Rows.Count} rows in the reference, {parity.RowCount} in Parity");
        switch (_operation)
        {
            case "filter":
            case "sort":
            {
                // Same rows in the same order: value and name per row (sorting: ties keep input order in both).
                var v = reference["value"];
                var s = reference["name"];
                var pv = (Float64Column)parity["value"];
                for (var i = 0; i < parity.RowCount; i += 997)
                {
                    if ((double)v[i]! != pv.Span[i])
                        throw new InvalidOperationException($"{Name}: row {i} value differs: {v[i]} vs {pv.Span[i]}");
                    // Equal values (a tie) may come in either order from the reference's sort.
                    var tie = (i > 0 && pv.Span[i - 1] == pv.Span[i]) || (i + 1 < pv.Length && pv.Span[i + 1] == pv.Span[i]);
                    if (!tie && (string)s[i]! != parity["name"].GetValue(i).String)
                        throw new InvalidOperationException($"{Name}: row {i} name differs");
                }
                break;
            }
            case "groupsum":
            {
                var byKey = new Dictionary<long, double>();
                for (var i = 0; i < reference.Rows.Count; i++) byKey[(long)reference["key"][i]!] = (double)reference["value"][i]!;
                for (var g = 0; g < parity.RowCount; g++)
                {
                    var k = parity["key"].GetValue(g).Int64;
                    var sum = parity["value"].GetValue(g).Float64;
                    // Summation order differs; IEEE 754 rounding gives a tiny relative difference at most.
                    if (Math.Abs(byKey[k] - sum) > 1e-9 * Math.Abs(sum)) throw new InvalidOperationException($"{Name}: key {k} sums differ");
                }
                break;
            }
            default:
            {
                double a = 0, b = 0;
                var rate = reference["rate"];
                // Rates are multiples of 0.25, so these sums are exact in any order.
                for (var i = 0; i < reference.Rows.Count; i++) a += (double)rate[i]!;
                for (var i = 0; i < parity.RowCount; i++) b += parity["rate"].GetValue(i).Float64;
                if (a != b) throw new InvalidOperationException($"{Name}: joined rates differ");
                break;
            }
        }
    }

    public override void Cleanup()
    {
        _df = null;
        _dfRight = null;
        _table = null;
        _right = null;
    }
}
