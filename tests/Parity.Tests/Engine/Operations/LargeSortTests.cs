using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Operations;

namespace Parity.Tests.Engine.Operations;

/// <summary>
/// The single-numeric-key sort above 65,536 rows (a most-significant bucket pass, then in-cache passes per
/// bucket) against a stable reference order computed independently with LINQ's OrderBy (documented stable).
/// </summary>
public sealed class LargeSortTests
{
    private static int[] Reference(double[] values, bool[] missing, bool descending)
    {
        // Spec §2.2 ordering: numbers (-0.0 equals 0.0), then a NaN value, then missing; ties in input order.
        static int Group(double v, bool m) => m ? 2 : double.IsNaN(v) ? 1 : 0;
        var idx = Enumerable.Range(0, values.Length);
        var byGroup = idx.OrderBy(i => Group(values[i], missing[i]));
        var ordered = descending
            ? byGroup.ThenByDescending(i => Group(values[i], missing[i]) == 0 ? values[i] + 0.0 : 0.0)
            : byGroup.ThenBy(i => Group(values[i], missing[i]) == 0 ? values[i] + 0.0 : 0.0);
        return ordered.ToArray();
    }

    [Theory]
    [InlineData(70_000, 1, false)]
    [InlineData(70_000, 2, true)]
    [InlineData(200_000, 3, false)]
    public void Doubles_sort_like_a_stable_reference(int n, int seed, bool descending)
    {
        var rng = new Random(seed);
        var values = new double[n];
        var missing = new bool[n];
        var bits = new byte[(n + 7) >> 3];
        for (var i = 0; i < n; i++)
        {
            var pick = rng.Next(100);
            // Mostly spread values, with many duplicates, both zeros, negatives, infinities and NaN values.
            values[i] = pick switch
            {
                < 60 => rng.NextDouble() * 1000 - 200,
                < 80 => rng.Next(50) * 0.5,
                < 83 => -0.0,
                < 86 => 0.0,
                < 88 => double.NegativeInfinity,
                < 90 => double.PositiveInfinity,
                < 93 => double.NaN,
                _ => rng.NextDouble() * 1e-300,
            };
            missing[i] = rng.Next(40) == 0;
            if (!missing[i]) bits[i >> 3] |= (byte)(1 << (i & 7));
        }
        var column = new Float64Column(values, new Validity(bits, 0, n), MissingMarker.Null);
        var table = new Table(["fare"], [column], n);
        Assert.Equal(Reference(values, missing, descending), Sorting.Permutation(table, [new SortKey("fare", descending)]));
    }

    [Fact]
    public void Int64_keys_over_the_whole_range_sort_stably()
    {
        const int n = 100_000;
        var rng = new Random(9);
        var values = new long[n];
        for (var i = 0; i < n; i++) values[i] = rng.Next(3) == 0 ? rng.Next(20) : rng.NextInt64(long.MinValue, long.MaxValue);
        var table = new Table(["id"], [new Int64Column(values, MissingMarker.Null)], n);
        var expected = Enumerable.Range(0, n).OrderBy(i => values[i]).ToArray(); // stable (LINQ OrderBy)
        Assert.Equal(expected, Sorting.Permutation(table, [new SortKey("id", false)]));
    }

    [Fact]
    public void Keys_alike_in_their_top_bits_sort_stably()
    {
        // Four clusters far apart, each with 2^20 low values and many ties: inside a bucket the top 16 varying
        // bits barely differ, so insertion sort would move too much and the in-cache step finishes by LSD passes.
        const int n = 200_000;
        var rng = new Random(12);
        var values = new long[n];
        for (var i = 0; i < n; i++) values[i] = ((long)rng.Next(4) << 40) + (rng.Next(2) == 0 ? rng.Next(1 << 20) : rng.Next(64));
        var table = new Table(["id"], [new Int64Column(values, MissingMarker.Null)], n);
        var expected = Enumerable.Range(0, n).OrderBy(i => values[i]).ToArray(); // stable (LINQ OrderBy)
        Assert.Equal(expected, Sorting.Permutation(table, [new SortKey("id", false)]));
        Assert.Equal(Enumerable.Range(0, n).OrderByDescending(i => values[i]).ToArray(), Sorting.Permutation(table, [new SortKey("id", true)]));
    }
}
