using System.Buffers;
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
        return CountingSort(acc, card);
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
    private static long[] CombinedKeys(Table table, IReadOnlyList<SortKey> keys, out int card)
    {
        var n = table.RowCount;
        var acc = new long[n];
        long combined = 1;
        var sortRanks = new int[n];
        for (var k = 0; k < keys.Count; k++)
        {
            var index = table.IndexOf(keys[k].Column);
            if (index < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{keys[k].Column}'");
            var ranks = ColumnRanker.Rank(table.Columns[index]);
            SortRanks(ranks, keys[k].Descending, sortRanks);
            KeyCombiner.Append(acc, ref combined, sortRanks, ranks.ValueCount + 1);
        }
        if (combined > Math.Min((long)n * 2 + 1024, Array.MaxLength - 1)) combined = KeyCombiner.Densify(acc, combined);
        card = (int)combined;
        return acc;
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
        var n = column.Length;
        var flip = descending ? ulong.MaxValue : 0UL;
        int m = 0, nanCount = 0, missingCount = 0;
        ulong[] keys;
        int[] rows;
        int[] tail; // NaN values from the front, missing rows from the back
        switch (column)
        {
            case Int64Column or TimestampColumn:
            {
                var p = (PrimitiveColumn<long>)column;
                var span = p.Span;
                var bits = p.Validity.Bits.Span;
                var off = p.Validity.BitOffset;
                RentScratch(n, out keys, out rows, out tail);
                for (var i = 0; i < n; i++)
                {
                    if (!ValidBits.IsValid(bits, off, i)) { tail[n - 1 - missingCount++] = i; continue; }
                    keys[m] = RadixRanks.OfLong(span[i]) ^ flip;
                    rows[m++] = i;
                }
                break;
            }
            case Float64Column f:
            {
                var span = f.Span;
                var bits = f.Validity.Bits.Span;
                var off = f.Validity.BitOffset;
                var nanIsMissing = f.Marker == MissingMarker.Nan;
                RentScratch(n, out keys, out rows, out tail);
                for (var i = 0; i < n; i++)
                {
                    var d = span[i];
                    if (!ValidBits.IsValid(bits, off, i) || (nanIsMissing && double.IsNaN(d))) { tail[n - 1 - missingCount++] = i; continue; }
                    if (double.IsNaN(d)) { tail[nanCount++] = i; continue; }
                    keys[m] = RadixRanks.OfDouble(d) ^ flip;
                    rows[m++] = i;
                }
                break;
            }
            default:
                perm = [];
                return false;
        }
        var (ownKeys, ownRows, ownTail) = (keys, rows, tail);
        RadixRanks.SortLarge(ref keys, ref rows, m);
        perm = new int[n];
        rows.AsSpan(0, m).CopyTo(perm);
        tail.AsSpan(0, nanCount).CopyTo(perm.AsSpan(m));
        // Missing rows were written backwards from the end of tail; restore input order.
        var at = m + nanCount;
        for (var k = 0; k < missingCount; k++) perm[at + k] = tail[n - 1 - k];
        ReturnScratch(n, ownKeys, ownRows, ownTail);
        return true;
    }

    /// <summary>
    /// One numeric key, first <paramref name="limit"/> rows only: the same order as <see cref="TrySingleNumeric"/>
    /// (values by their order-preserving keys, complemented when descending, then NaN values, then missing).
    /// </summary>
    private static bool TrySingleNumericTop(Column column, bool descending, int limit, out int[] top)
    {
        const int Value = 0, NaNValue = 1, Missing = 2;
        var n = column.Length;
        var flip = descending ? ulong.MaxValue : 0UL;
        var heap = new TopRows(limit);
        switch (column)
        {
            case Int64Column or TimestampColumn:
            {
                var p = (PrimitiveColumn<long>)column;
                var span = p.Span;
                var bits = p.Validity.Bits.Span;
                var off = p.Validity.BitOffset;
                for (var i = 0; i < n; i++)
                {
                    if (ValidBits.IsValid(bits, off, i)) heap.Offer(Value, RadixRanks.OfLong(span[i]) ^ flip, i);
                    else heap.Offer(Missing, 0, i);
                }
                break;
            }
            case Float64Column f:
            {
                var span = f.Span;
                var bits = f.Validity.Bits.Span;
                var off = f.Validity.BitOffset;
                var nanIsMissing = f.Marker == MissingMarker.Nan;
                for (var i = 0; i < n; i++)
                {
                    var d = span[i];
                    if (!ValidBits.IsValid(bits, off, i) || (nanIsMissing && double.IsNaN(d))) heap.Offer(Missing, 0, i);
                    else if (double.IsNaN(d)) heap.Offer(NaNValue, 0, i);
                    else heap.Offer(Value, RadixRanks.OfDouble(d) ^ flip, i);
                }
                break;
            }
            default:
                top = [];
                return false;
        }
        top = heap.SortedRows();
        return true;
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
