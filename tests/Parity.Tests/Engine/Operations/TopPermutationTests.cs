using FsCheck.Xunit;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

/// <summary>
/// <c>Sorting.Permutation(table, keys, limit)</c> (the bounded selection behind <c>order by … take N</c>) must give
/// exactly the first <c>limit</c> entries of the full stable permutation, whose order spec §2.2 fixes (missing last
/// in both directions, a NaN value after the other values, ties in input order, -0.0 equal to 0.0).
/// </summary>
public sealed class TopPermutationTests
{
    private static readonly string[] Modes = ["legacy", "modern", "arrow+nan+cow", "boxed+null+alias"];

    private static readonly object?[] Numbers = [null, -2L, 0L, 5L, 5L, 9L, long.MinValue, long.MaxValue];

    // NaN is missing under nan and a value under null (spec §2.1); -0.0 and 0.0 tie.
    private static readonly object?[] Floats = [null, double.NaN, -0.0, 0.0, 1.5, -1.5, double.PositiveInfinity, double.NegativeInfinity];

    private static readonly object?[] Words = [null, "Ola", "ola", "Σοφία", "\uFF21", "🚢", ""];

    [Property(MaxTest = 150)]
    public bool First_entries_of_the_full_permutation(int seed)
    {
        var rng = new Random(seed);
        var rows = rng.Next(0, 300);
        var mode = M(Modes[rng.Next(Modes.Length)]);
        var ints = new object?[rows];
        var floats = new object?[rows];
        var words = new object?[rows];
        var stamps = new object?[rows];
        for (var r = 0; r < rows; r++)
        {
            ints[r] = Numbers[rng.Next(Numbers.Length)];
            floats[r] = Floats[rng.Next(Floats.Length)];
            words[r] = Words[rng.Next(Words.Length)];
            stamps[r] = rng.Next(6) == 0 ? null : new DateTime(2026, 5, 1 + rng.Next(3), 0, 0, 0, DateTimeKind.Utc);
        }
        var table = Table(("i", Col(mode, ints)), ("f", Col(mode, floats)), ("s", Col(mode, words)), ("t", Col(mode, stamps)));
        var pool = new List<string> { "i", "f", "s", "t" };
        var keys = new List<SortKey>();
        for (var k = rng.Next(1, 4); k > 0; k--)
        {
            var name = pool[rng.Next(pool.Count)];
            pool.Remove(name);
            keys.Add(new SortKey(name, rng.Next(2) == 0));
        }
        // Limits across the selection path (below a quarter of the rows) and the full sort, and past the end.
        var limit = rng.Next(4) == 0 ? rng.Next(0, rows + 5) : rng.Next(0, Math.Max(1, rows / 4));
        var full = Sorting.Permutation(table, keys);
        var top = Sorting.Permutation(table, keys, limit);
        return top.AsSpan().SequenceEqual(full.AsSpan(0, Math.Min(limit, rows)));
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void A_large_single_key_selection_matches_the_sort(bool descending)
    {
        // 200,000 doubles with many ties, NaN values and missing cells under null: the bounded heap sees most rows
        // rejected at its root, and the kept 1,000 must still come out in the sort's order.
        const int n = 200_000;
        var rng = new Random(11);
        var cells = new object?[n];
        for (var i = 0; i < n; i++)
            cells[i] = rng.Next(50) == 0 ? null : rng.Next(50) == 0 ? double.NaN : rng.Next(-500, 500) * 0.25;
        var table = Table(("fare", Col(Mode.Modern, cells)));
        var keys = new[] { new SortKey("fare", descending) };
        Assert.Equal(Sorting.Permutation(table, keys).AsSpan(0, 1_000).ToArray(), Sorting.Permutation(table, keys, 1_000));
    }
}
