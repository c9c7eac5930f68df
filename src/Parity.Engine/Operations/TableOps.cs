using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Operations.Internal;

namespace Parity.Engine.Operations;

/// <summary>Row selection over immutable tables: gather by index, filter by mask, drop rows with missing cells.</summary>
public static class TableOps
{
    /// <summary>
    /// Rows by index; -1 gives a missing cell. The result columns follow the §2.1 representation of
    /// <paramref name="mode"/> (under <c>nan</c> an int64 column that gains a missing cell becomes float64, a
    /// bool column becomes object).
    /// </summary>
    public static Table Gather(Table table, ReadOnlySpan<int> rows, Mode mode)
    {
        var anyMissing = rows.IndexOf(-1) >= 0;
        var columns = new Column[table.ColumnCount];
        for (var c = 0; c < columns.Length; c++)
        {
            var gathered = Gatherer.Gather(table.Columns[c], rows);
            columns[c] = anyMissing ? ColumnFactory.Normalize(gathered, mode) : gathered;
        }
        return new Table(table.Names, columns, rows.Length);
    }

    /// <summary>The rows whose flag in <paramref name="keep"/> is true, in order.</summary>
    public static Table Filter(Table table, ReadOnlySpan<bool> keep)
    {
        if (keep.Length != table.RowCount) throw new ArgumentException("mask length differs from row count", nameof(keep));
        var count = keep.Count(true);
        // Branch-free: every row index is written, the cursor moves only past kept ones (a mask of mixed
        // flags would otherwise mispredict about every other row). One spare slot takes the last write.
        var rows = GC.AllocateUninitializedArray<int>(count + 1);
        var j = 0;
        for (var i = 0; i < keep.Length; i++)
        {
            rows[j] = i;
            j += keep[i] ? 1 : 0;
        }
        return GatherExisting(table, rows.AsSpan(0, count));
    }

    /// <summary>
    /// <c>drop missing</c>: drops rows with a missing value (any marker) in <paramref name="columns"/>
    /// (an empty list means every column).
    /// </summary>
    public static Table DropMissing(Table table, IReadOnlyList<string> columns)
    {
        var n = table.RowCount;
        var missing = new bool[n];
        var count = columns.Count == 0 ? table.ColumnCount : columns.Count;
        for (var k = 0; k < count; k++)
        {
            var index = columns.Count == 0 ? k : table.IndexOf(columns[k]);
            if (index < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{columns[k]}'");
            ColumnRanker.MarkMissing(table.Columns[index], missing);
        }
        var kept = 0;
        foreach (var m in missing)
            if (!m) kept++;
        if (kept == n) return new Table(table.Names, table.Columns, n); // columns are immutable: share them
        var rows = new int[kept];
        var j = 0;
        for (var i = 0; i < n; i++)
            if (!missing[i]) rows[j++] = i;
        return GatherExisting(table, rows);
    }

    /// <summary>Gathers existing rows only (no -1), so no column needs re-normalising.</summary>
    private static Table GatherExisting(Table table, ReadOnlySpan<int> rows)
    {
        var columns = new Column[table.ColumnCount];
        for (var c = 0; c < columns.Length; c++) columns[c] = Gatherer.Gather(table.Columns[c], rows);
        return new Table(table.Names, columns, rows.Length);
    }
}
