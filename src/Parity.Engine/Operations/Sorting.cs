using System.Buffers;
using System.Runtime.CompilerServices;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Operations.Internal;

namespace Parity.Engine.Operations;

/// <summary>
/// Stable multi-key ordering (spec §2.2 "Ordering"). The order, in every mode:
/// <list type="bullet">
/// <item>numbers numerically (-0.0 equals 0.0); bools false &lt; true; timestamps by instant;</item>
/// <item>strings in Unicode code point order (UTF-8 byte order; boxed strings via <see cref="Text.CodePointOrder"/>);</item>
/// <item>mixed (object) columns by kind first: numbers &lt; bools &lt; strings &lt; timestamps, then by value;</item>
/// <item>a NaN that is a value (null modes) after every other value but before missing, in both directions;</item>
/// <item>missing values (any marker) last in both directions;</item>
/// <item>ties keep input order.</item>
/// </list>
/// A single numeric key is radix-sorted directly. Otherwise each key column is reduced to dense ranks
/// (distinct values hashed from typed buffers and only those sorted, or a radix sort when nearly every value
/// is distinct), the ranks are combined into one integer per row and a counting sort gives the permutation.
/// </summary>
public static class Sorting
{
    /// <summary>Row indices in sorted order: <c>result[k]</c> is the input row that goes to position k.</summary>
    public static int[] Permutation(Table table, IReadOnlyList<SortKey> keys)
    {
        var n = table.RowCount;
        if (keys.Count == 0 || n == 0) return ColumnRanker.Iota(n);
        if (keys.Count == 1)
        {
            var only = table.IndexOf(keys[0].Column);
            if (only >= 0 && TrySingleNumeric(table.Columns[only], keys[0].Descending, out var direct)) return direct;
        }
        var acc = CombinedKeys(table, keys, out var card);
        // A counting sort needs keys dense enough to count; the heap of the limited form does not.
        if (card > Math.Min((long)table.RowCount * 2 + 1024, Array.MaxLength - 1)) card = KeyCombiner.Densify(acc, card);
        return CountingSort(acc, (int)card);
    }

    /// <summary>
    /// The first <paramref name="limit"/> entries of <see cref="Permutation(Table, IReadOnlyList{SortKey})"/>: the
    /// same rows in the same order (<c>order by … take N</c>). A limit below a quarter of the rows keeps the
    /// smallest rows in a bounded heap as each row passes once, instead of sorting them all.
    /// </summary>
    public static int[] Permutation(Table table, IReadOnlyList<SortKey> keys, int limit)
    {
        var n = table.RowCount;
        limit = Math.Clamp(limit, 0, n);
        if (keys.Count == 0) return ColumnRanker.Iota(limit);
        if (limit >= n / 4) return limit == n ? Permutation(table, keys) : Permutation(table, keys).AsSpan(0, limit).ToArray();
        if (keys.Count == 1)
        {
            var only = table.IndexOf(keys[0].Column);
            if (only >= 0 && TrySingleNumericTop(table.Columns[only], keys[0].Descending, limit, out var direct)) return direct;
        }
        var acc = CombinedKeys(table, keys, out _);
        var top = new TopRows(limit);
        for (var i = 0; i < acc.Length; i++) top.Offer(0, (ulong)acc[i], i);
        return top.SortedRows();
    }

    /// <summary>One non-negative key per row that orders rows as the sort keys do (ties left to input order); <paramref name="card"/> bounds it.</summary>
    private static long[] CombinedKeys(Table table, IReadOnlyList<SortKey> keys, out long card)
    {
        var n = table.RowCount;
        var acc = new long[n];
        card = 1;
        var sortRanks = new int[n];
        for (var k = 0; k < keys.Count; k++)
        {
            var index = table.IndexOf(keys[k].Column);
            if (index < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{keys[k].Column}'");
            if (table.Columns[index] is ObjectColumn cells) RequireOneKind(cells, keys[k].Column);
            var ranks = ColumnRanker.Rank(table.Columns[index]);
            SortRanks(ranks, keys[k].Descending, sortRanks);
            KeyCombiner.Append(acc, ref card, sortRanks, ranks.ValueCount + 1);
        }
        return acc;
    }

    /// <summary>
    /// docs/semantics.md, "Ordering": a boxed column whose cells are of more than one kind (numbers, bools,
    /// strings, timestamps; int64 and float64 are one kind) cannot be ordered, as comparing its cells with
    /// <c>&lt;</c> cannot: <c>E-TYPE</c> naming the first row of each of two kinds.
    /// </summary>
    private static void RequireOneKind(ObjectColumn column, string name)
    {
        var cells = column.Cells.Span;
        var marker = column.Marker;
        var firstRow = -1;
        var firstKind = -1;
        for (var i = 0; i < cells.Length; i++)
        {
            var c = cells[i];
            if (ObjectColumn.IsMissingCell(c, marker)) continue;
            var kind = CellOrder.KindOf(c!);
            if (firstRow < 0) { firstRow = i; firstKind = kind; continue; }
            if (kind == firstKind) continue;
            throw new EngineException(ErrorCodes.Type,
                $"cannot order column '{name}': it mixes {CellOrder.KindName(firstKind)} (row {firstRow}) and {CellOrder.KindName(kind)} (row {i}), which do not compare");
        }
    }

    /// <summary>Ranks as sort positions: values (reversed when descending), then the NaN value, then missing.</summary>
    private static void SortRanks(KeyRanks ranks, bool descending, int[] into)
    {
        var src = ranks.Ranks;
        var missing = ranks.ValueCount;
        var top = ranks.OrdinaryCount - 1;
        for (var i = 0; i < src.Length; i++)
        {
            var r = src[i];
            into[i] = r < 0 ? missing : descending && r <= top ? top - r : r;
        }
    }

    /// <summary>
    /// One numeric key: a stable radix sort of order-preserving keys (complemented when descending, so ties
    /// keep input order), then the NaN-value rows, then the missing rows, each in input order.
    /// </summary>
    private static bool TrySingleNumeric(Column column, bool descending, out int[] perm)
    {
        perm = [];
        if (!IsNumeric(column)) return false;
        var n = column.Length;
        var scratch = new ScratchRows(n);
        Classify(column, descending, ref scratch);
        var (keys, rows, tail, m, nanCount, missingCount) = (scratch.Keys, scratch.Rows, scratch.Tail, scratch.Count, scratch.NaNCount, scratch.MissingCount);
        RadixRanks.SortLarge(ref keys, ref rows, m);
        perm = new int[n];
        rows.AsSpan(0, m).CopyTo(perm);
        tail.AsSpan(0, nanCount).CopyTo(perm.AsSpan(m));
        // Missing rows were written backwards from the end of tail; restore input order.
        var at = m + nanCount;
        for (var k = 0; k < missingCount; k++) perm[at + k] = tail[n - 1 - k];
        ReturnScratch(n, scratch.Keys, scratch.Rows, scratch.Tail);
        return true;
    }

    /// <summary>One numeric key, first <paramref name="limit"/> rows only: the same order as <see cref="TrySingleNumeric"/>.</summary>
    private static bool TrySingleNumericTop(Column column, bool descending, int limit, out int[] top)
    {
        top = [];
        if (!IsNumeric(column)) return false;
        var heap = new HeapRows(new TopRows(limit));
        Classify(column, descending, ref heap);
        top = heap.Top.SortedRows();
        return true;
    }

    private static bool IsNumeric(Column column) => column is Int64Column or TimestampColumn or Float64Column;

    /// <summary>
    /// Sends every row of a numeric column to <paramref name="sink"/> in input order: a value with its
    /// order-preserving key (complemented when descending), a NaN that is a value, or a missing cell.
    /// </summary>
    private static void Classify<TSink>(Column column, bool descending, ref TSink sink)
        where TSink : struct, INumericRows
    {
        var n = column.Length;
        var flip = descending ? ulong.MaxValue : 0UL;
        if (column is Float64Column f)
        {
            var span = f.Span;
            var bits = f.Validity.Bits.Span;
            var off = f.Validity.BitOffset;
            var nanIsMissing = f.Marker == MissingMarker.Nan;
            for (var i = 0; i < n; i++)
            {
                var d = span[i];
                if (!ValidBits.IsValid(bits, off, i) || (nanIsMissing && double.IsNaN(d))) sink.Missing(i);
                else if (double.IsNaN(d)) sink.NaNValue(i);
                else sink.Value(RadixRanks.OfDouble(d) ^ flip, i);
            }
            return;
        }
        var p = (PrimitiveColumn<long>)column;
        var longs = p.Span;
        var valid = p.Validity.Bits.Span;
        var offset = p.Validity.BitOffset;
        for (var i = 0; i < n; i++)
        {
            if (ValidBits.IsValid(valid, offset, i)) sink.Value(RadixRanks.OfLong(longs[i]) ^ flip, i);
            else sink.Missing(i);
        }
    }

    /// <summary>Where <see cref="Classify"/> sends each row (a struct, so the loop is specialised per sink).</summary>
    private interface INumericRows
    {
        void Value(ulong key, int row);

        void NaNValue(int row);

        void Missing(int row);
    }

    /// <summary>Values into (key, row) scratch arrays for the radix sort; NaN values from the front of the tail, missing rows from its back.</summary>
    private struct ScratchRows : INumericRows
    {
        public ulong[] Keys;
        public int[] Rows;
        public int[] Tail;
        public int Count;
        public int NaNCount;
        public int MissingCount;
        private readonly int _n;

        public ScratchRows(int n)
        {
            _n = n;
            RentScratch(n, out Keys, out Rows, out Tail);
        }

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Value(ulong key, int row)
        {
            Keys[Count] = key;
            Rows[Count++] = row;
        }

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void NaNValue(int row) => Tail[NaNCount++] = row;

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Missing(int row) => Tail[_n - 1 - MissingCount++] = row;
    }

    /// <summary>Every row offered to a bounded heap in its class: values, then NaN values, then missing.</summary>
    private readonly struct HeapRows(TopRows top) : INumericRows
    {
        public TopRows Top { get; } = top;

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Value(ulong key, int row) => Top.Offer(0, key, row);

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void NaNValue(int row) => Top.Offer(1, 0, row);

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public void Missing(int row) => Top.Offer(2, 0, row);
    }

    /// <summary>Large scratch arrays come from the shared pool: fresh large arrays are slow to touch and wake the full GC.</summary>
    private static void RentScratch(int n, out ulong[] keys, out int[] rows, out int[] tail)
    {
        if (n < PooledFrom)
        {
            keys = new ulong[n];
            rows = new int[n];
            tail = new int[n];
            return;
        }
        keys = ArrayPool<ulong>.Shared.Rent(n);
        rows = ArrayPool<int>.Shared.Rent(n);
        tail = ArrayPool<int>.Shared.Rent(n);
    }

    /// <summary>Returns what <see cref="RentScratch"/> rented (the originals, whatever the sort swapped in).</summary>
    private static void ReturnScratch(int n, ulong[] keys, int[] rows, int[] tail)
    {
        if (n < PooledFrom) return;
        ArrayPool<ulong>.Shared.Return(keys);
        ArrayPool<int>.Shared.Return(rows);
        ArrayPool<int>.Shared.Return(tail);
    }

    private const int PooledFrom = 1 << 16;

    /// <summary>Stable: rows with equal keys keep their input order.</summary>
    private static int[] CountingSort(long[] keys, int card)
    {
        var starts = new int[card + 1];
        for (var i = 0; i < keys.Length; i++) starts[keys[i] + 1]++;
        for (var k = 0; k < card; k++) starts[k + 1] += starts[k];
        var perm = new int[keys.Length];
        for (var i = 0; i < keys.Length; i++) perm[starts[keys[i]]++] = i;
        return perm;
    }
}
