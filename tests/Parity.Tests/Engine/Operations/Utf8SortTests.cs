using System.Text;
using FsCheck.Xunit;
using Parity.Engine.Modes;
using Parity.Engine.Operations;
using static Parity.Tests.Engine.Operations.OpsData;

namespace Parity.Tests.Engine.Operations;

/// <summary>
/// Strings are ranked by an 8-byte prefix first and the full bytes only where prefixes tie. Long strings that share
/// their first eight bytes, U+0000 (a zero byte, like the padding of a short prefix), characters split by the
/// eighth byte and code points above U+FFFF must still come out in Unicode code point order, which for UTF-8 is
/// byte order (Unicode Standard, §2.5 and §3.9, UTF-8; the reference compares .NET's Encoding.UTF8 bytes).
/// </summary>
public sealed class Utf8SortTests
{
    private static readonly string[] Pieces = ["harbor", "line", "\0", "a", "é", "🚢", "\uFF21", "", "Z"];

    [Property(MaxTest = 200)]
    public bool Strings_sort_in_code_point_order(int seed, bool descending)
    {
        var rng = new Random(seed);
        var rows = rng.Next(0, 120);
        var mode = rng.Next(2) == 0 ? Mode.Modern : Mode.Legacy;
        var cells = new object?[rows];
        for (var r = 0; r < rows; r++)
        {
            if (rng.Next(10) == 0) continue; // missing
            var sb = new StringBuilder("harbor line ");
            for (var k = rng.Next(0, 5); k > 0; k--) sb.Append(Pieces[rng.Next(Pieces.Length)]);
            cells[r] = rng.Next(4) == 0 ? sb.ToString(12, sb.Length - 12) : sb.ToString();
        }
        var perm = Sorting.Permutation(Table(("s", Col(mode, cells))), [new SortKey("s", descending)]);
        // Spec §2.2: missing last in both directions, ties in input order (LINQ's OrderBy is stable).
        var present = Enumerable.Range(0, rows).Where(i => cells[i] is not null);
        var byBytes = Comparer<int>.Create((a, b) => Encoding.UTF8.GetBytes((string)cells[a]!).AsSpan().SequenceCompareTo(Encoding.UTF8.GetBytes((string)cells[b]!)));
        var ordered = descending ? present.OrderByDescending(i => i, byBytes) : present.OrderBy(i => i, byBytes);
        var expected = ordered.Concat(Enumerable.Range(0, rows).Where(i => cells[i] is null));
        return perm.SequenceEqual(expected);
    }
}
