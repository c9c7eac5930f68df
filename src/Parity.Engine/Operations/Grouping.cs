using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
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
        int[] groupOf;
        int groupCount;
        if (keys.Count == 1)
        {
            // One key: its dense ranks already are group numbers in ascending key order.
            var ranks = ColumnRanker.Rank(KeyColumn(table, keys[0]));
            groupOf = ranks.Ranks;
            groupCount = ranks.ValueCount;
            for (var i = 0; i < groupOf.Length; i++)
                if (groupOf[i] < 0) groupOf[i] = -1; // a boxed None (-2) is just missing here
        }
        else
        {
            var acc = new long[n];
            long card = 1;
            for (var k = 0; k < keys.Count; k++)
            {
                var ranks = ColumnRanker.Rank(KeyColumn(table, keys[k]));
                KeyCombiner.Append(acc, ref card, ranks.Ranks, ranks.ValueCount);
            }
            groupCount = KeyCombiner.Densify(acc, card);
            groupOf = new int[n];
            for (var i = 0; i < n; i++) groupOf[i] = (int)acc[i];
        }
        var representative = new int[groupCount];
        representative.AsSpan().Fill(-1);
        var dropped = 0;
        for (var i = 0; i < n; i++)
        {
            var g = groupOf[i];
            if (g < 0) { dropped++; continue; }
            if (representative[g] < 0) representative[g] = i;
        }
        return new GroupIndex(groupOf, groupCount, representative, dropped);
    }

    /// <summary>
    /// The key columns of the result, one row per group (the first row of each). docs/semantics.md, "Grouping":
    /// under <c>nan</c> a bool column with missing values is <c>object</c>; once the rows with a missing key are
    /// dropped its keys are plain booleans, so the key column comes out <c>bool</c>.
    /// </summary>
    public static Table KeyTable(Table table, IReadOnlyList<string> keys, GroupIndex groups, Mode mode)
    {
        var columns = new Column[keys.Count];
        for (var i = 0; i < columns.Length; i++) columns[i] = KeyColumn(table, keys[i]);
        var gathered = TableOps.Gather(new Table(keys, columns, table.RowCount), groups.Representative, mode);
        var result = new Column[columns.Length];
        for (var i = 0; i < result.Length; i++)
            result[i] = gathered.Columns[i] is ObjectColumn o ? (Column?)AsBools(o) ?? o : gathered.Columns[i];
        return new Table(gathered.Names, result, gathered.RowCount);
    }

    /// <summary>A bool column of the same cells when every cell is a bool; otherwise null.</summary>
    private static BoolColumn? AsBools(ObjectColumn column)
    {
        var cells = column.Cells.Span;
        var data = new bool[cells.Length];
        for (var i = 0; i < cells.Length; i++)
        {
            if (cells[i] is not bool b) return null;
            data[i] = b;
        }
        return new BoolColumn(data, column.Marker);
    }

    private static Column KeyColumn(Table table, string name)
    {
        var index = table.IndexOf(name);
        if (index < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{name}'");
        return table.Columns[index];
    }
}
