using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Operations.Internal;

namespace Parity.Engine.Operations;

/// <summary>
/// <c>group by</c> (spec §2.2): rows whose key is missing (any marker, in any key column) are dropped; groups
/// are numbered in ascending key order, the same order as <see cref="Sorting"/> (a NaN that is a value is one
/// group, after the numbers; -0.0 and 0.0 are one group; in a mixed column an int64 and a float64 of equal
/// value are one group).
/// </summary>
public static class Grouping
{
    public static GroupIndex Group(Table table, IReadOnlyList<string> keys)
    {
        var n = table.RowCount;
        if (keys.Count == 0) return GroupIndex.Single(n);
        var acc = new long[n];
        long card = 1;
        for (var k = 0; k < keys.Count; k++)
        {
            var index = table.IndexOf(keys[k]);
            if (index < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{keys[k]}'");
            var ranks = ColumnRanker.Rank(table.Columns[index]);
            KeyCombiner.Append(acc, ref card, ranks.Ranks, ranks.ValueCount);
        }
        var groupCount = KeyCombiner.Densify(acc, card);
        var groupOf = new int[n];
        var representative = new int[groupCount];
        representative.AsSpan().Fill(-1);
        var dropped = 0;
        for (var i = 0; i < n; i++)
        {
            var g = (int)acc[i];
            groupOf[i] = g;
            if (g < 0) { dropped++; continue; }
            if (representative[g] < 0) representative[g] = i;
        }
        return new GroupIndex(groupOf, groupCount, representative, dropped);
    }
}
