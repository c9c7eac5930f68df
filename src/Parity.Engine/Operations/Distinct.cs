using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Operations.Internal;

namespace Parity.Engine.Operations;

/// <summary>
/// <c>distinct</c> (spec §2.3): the first row of each distinct combination, in input order. For this purpose
/// a missing cell equals a missing cell of the same kind (NaN = NaN, null = null, None = None, but a boxed
/// <c>None</c> differs from a boxed NaN); values compare as in grouping (-0.0 = 0.0, one NaN value).
/// </summary>
public static class Distinct
{
    /// <summary>Indices of the kept rows; an empty <paramref name="columns"/> list means every column.</summary>
    public static int[] FirstRows(Table table, IReadOnlyList<string> columns)
    {
        var n = table.RowCount;
        var count = columns.Count == 0 ? table.ColumnCount : columns.Count;
        var acc = new long[n];
        long card = 1;
        var codes = new int[n];
        for (var k = 0; k < count; k++)
        {
            var index = columns.Count == 0 ? k : table.IndexOf(columns[k]);
            if (index < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{columns[k]}'");
            var ranks = ColumnRanker.Rank(table.Columns[index]);
            var src = ranks.Ranks;
            var vc = ranks.ValueCount;
            // Missing kinds become codes of their own after the values: -1 -> vc, -2 -> vc + 1.
            for (var i = 0; i < n; i++) codes[i] = src[i] >= 0 ? src[i] : vc - 1 - src[i];
            KeyCombiner.Append(acc, ref card, codes, vc + 2);
        }
        var distinct = KeyCombiner.Densify(acc, card);
        var seen = new bool[distinct];
        var rows = new List<int>(Math.Min(distinct, n));
        for (var i = 0; i < n; i++)
        {
            var g = acc[i];
            if (seen[g]) continue;
            seen[g] = true;
            rows.Add(i);
        }
        return rows.ToArray();
    }
}
