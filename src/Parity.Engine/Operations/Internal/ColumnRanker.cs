using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Text;

namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Turns a column into <see cref="KeyRanks"/>: distinct values are found by hashing typed buffers (long bits,
/// normalised double bits, UTF-8 bytes, boxed cells), then only the distinct values are sorted. Sorting,
/// grouping, distinct and count_distinct all work on these ranks, so every type is handled in one place.
/// </summary>
internal static class ColumnRanker
{
    public static KeyRanks Rank(Column column) => column switch
    {
        Int64Column c => RankLongs(c.Span, c.Validity),
        TimestampColumn c => RankLongs(c.Span, c.Validity),
        BoolColumn c => RankBools(c.Span, c.Validity),
        Float64Column c => RankDoubles(c.Span, c.Validity, c.Marker == MissingMarker.Nan),
        Utf8Column c => RankUtf8(c),
        ObjectColumn c => RankCells(c.Cells.Span, c.Marker),
        _ => throw new EngineException(ErrorCodes.Internal, "unsupported column type " + column.TypeLabel),
    };

    /// <summary>Sets <c>missing[i]</c> for every missing cell (any marker); leaves other flags as they are.</summary>
    public static void MarkMissing(Column column, Span<bool> missing)
    {
        switch (column)
        {
            case Float64Column f:
            {
                var span = f.Span;
                var nanIsMissing = f.Marker == MissingMarker.Nan;
                var v = f.Validity;
                for (var i = 0; i < span.Length; i++)
                    if ((nanIsMissing && double.IsNaN(span[i])) || !v.IsValid(i)) missing[i] = true;
                return;
            }
            case Int64Column p: MarkInvalid(p.Validity, missing); return;
            case TimestampColumn p: MarkInvalid(p.Validity, missing); return;
            case BoolColumn p: MarkInvalid(p.Validity, missing); return;
            case Utf8Column u:
            {
                if (u.MissingCount == 0) return;
                for (var i = 0; i < u.Length; i++)
                    if (u.Array.IsNull(i)) missing[i] = true;
                return;
            }
            case ObjectColumn o:
            {
                var cells = o.Cells.Span;
                for (var i = 0; i < cells.Length; i++)
                    if (ObjectColumn.IsMissingCell(cells[i], o.Marker)) missing[i] = true;
                return;
            }
            default:
                for (var i = 0; i < column.Length; i++)
                    if (column.IsMissing(i)) missing[i] = true;
                return;
        }
    }

    private static void MarkInvalid(Validity validity, Span<bool> missing)
    {
        if (!validity.HasBitmap) return;
        var bits = validity.Bits.Span;
        var off = validity.BitOffset;
        for (var i = 0; i < validity.Length; i++)
        {
            var b = off + i;
            if ((bits[b >> 3] & (1 << (b & 7))) == 0) missing[i] = true;
        }
    }

    private static KeyRanks RankLongs(ReadOnlySpan<long> values, Validity validity)
    {
        var n = values.Length;
        var ranks = new int[n];
        var bits = validity.Bits.Span;
        var off = validity.BitOffset;
        var all = !validity.HasBitmap;
        long min = long.MaxValue, max = long.MinValue;
        var any = false;
        for (var i = 0; i < n; i++)
        {
            if (!all && (bits[(off + i) >> 3] & (1 << ((off + i) & 7))) == 0) continue;
            var v = values[i];
            if (v < min) min = v;
            if (v > max) max = v;
            any = true;
        }
        if (!any)
        {
            ranks.AsSpan().Fill(-1);
            return new KeyRanks(ranks, 0, false);
        }
        var range = (ulong)max - (ulong)min;
        if (range < (ulong)Math.Min((long)n * 2 + 1024, Array.MaxLength - 1))
        {
            // Dense range: a presence table indexed by value - min, no hashing at all.
            var table = new int[(int)range + 1];
            for (var i = 0; i < n; i++)
            {
                if (!all && (bits[(off + i) >> 3] & (1 << ((off + i) & 7))) == 0) continue;
                table[(int)((ulong)values[i] - (ulong)min)] = 1;
            }
            var next = 0;
            for (var k = 0; k < table.Length; k++)
                if (table[k] != 0) table[k] = ++next;
            for (var i = 0; i < n; i++)
            {
                if (!all && (bits[(off + i) >> 3] & (1 << ((off + i) & 7))) == 0) { ranks[i] = -1; continue; }
                ranks[i] = table[(int)((ulong)values[i] - (ulong)min)] - 1;
            }
            return new KeyRanks(ranks, next, false);
        }
        var map = new LongIdMap();
        var limit = HashLimit(n);
        for (var i = 0; i < n; i++)
        {
            if (!all && (bits[(off + i) >> 3] & (1 << ((off + i) & 7))) == 0) { ranks[i] = -1; continue; }
            ranks[i] = map.GetOrAdd(values[i]);
            if (map.Count > limit) return RadixLongs(values, validity, ranks);
        }
        var keys = map.Keys.ToArray();
        var ids = Iota(keys.Length);
        Array.Sort(keys, ids);
        RemapIds(ranks, ids);
        return new KeyRanks(ranks, keys.Length, false);
    }

    private static KeyRanks RankBools(ReadOnlySpan<bool> values, Validity validity)
    {
        var n = values.Length;
        var ranks = new int[n];
        bool anyFalse = false, anyTrue = false;
        for (var i = 0; i < n; i++)
        {
            if (!validity.IsValid(i)) { ranks[i] = -1; continue; }
            if (values[i]) anyTrue = true;
            else anyFalse = true;
            ranks[i] = values[i] ? 1 : 0;
        }
        if (anyTrue && !anyFalse)
            for (var i = 0; i < n; i++)
                if (ranks[i] == 1) ranks[i] = 0;
        return new KeyRanks(ranks, (anyFalse ? 1 : 0) + (anyTrue ? 1 : 0), false);
    }

    private static KeyRanks RankDoubles(ReadOnlySpan<double> values, Validity validity, bool nanIsMissing)
    {
        var n = values.Length;
        var ranks = new int[n];
        var map = new LongIdMap();
        var anyNaN = false;
        var bits = validity.Bits.Span;
        var off = validity.BitOffset;
        var limit = HashLimit(n);
        for (var i = 0; i < n; i++)
        {
            var d = values[i];
            if (!ValidBits.IsValid(bits, off, i)) { ranks[i] = -1; continue; }
            if (double.IsNaN(d))
            {
                if (nanIsMissing) { ranks[i] = -1; continue; }
                anyNaN = true;
                ranks[i] = int.MinValue; // fixed up below: the NaN value ranks last
                continue;
            }
            ranks[i] = map.GetOrAdd(KeyBits.OfDouble(d));
            if (map.Count > limit) return RadixDoubles(values, validity, nanIsMissing, ranks);
        }
        var bitsKeys = map.Keys;
        var keys = new double[bitsKeys.Length];
        for (var k = 0; k < keys.Length; k++) keys[k] = BitConverter.Int64BitsToDouble(bitsKeys[k]);
        var ids = Iota(keys.Length);
        Array.Sort(keys, ids);
        var rankOf = Inverse(ids);
        var nanRank = keys.Length;
        for (var i = 0; i < n; i++)
        {
            var r = ranks[i];
            if (r >= 0) ranks[i] = rankOf[r];
            else if (r == int.MinValue) ranks[i] = nanRank;
        }
        return new KeyRanks(ranks, keys.Length + (anyNaN ? 1 : 0), anyNaN);
    }

    private static KeyRanks RankUtf8(Utf8Column column)
    {
        var n = column.Length;
        var ranks = new int[n];
        var map = new Utf8IdMap();
        map.Code(column, ranks, insert: true, missingCode: -1);
        var ids = SortedIds(map);
        RemapIds(ranks, ids);
        return new KeyRanks(ranks, ids.Length, false);
    }

    private static KeyRanks RankCells(ReadOnlySpan<object?> cells, MissingMarker marker)
    {
        var n = cells.Length;
        var ranks = new int[n];
        var map = new Dictionary<object, int>(CellOrder.Instance);
        var reps = new List<object>();
        var anyNaN = false;
        var nan = marker == MissingMarker.Nan;
        for (var i = 0; i < n; i++)
        {
            var c = cells[i];
            if (c is null) { ranks[i] = nan ? -2 : -1; continue; }
            if (c is double d && double.IsNaN(d))
            {
                if (nan) { ranks[i] = -1; continue; }
                anyNaN = true;
                ranks[i] = int.MinValue;
                continue;
            }
            if (!map.TryGetValue(c, out var id))
            {
                id = reps.Count;
                map.Add(c, id);
                reps.Add(c);
            }
            ranks[i] = id;
        }
        var keys = reps.ToArray();
        var ids = Iota(keys.Length);
        Array.Sort(keys, ids, CellOrder.Instance);
        var rankOf = Inverse(ids);
        for (var i = 0; i < n; i++)
        {
            var r = ranks[i];
            if (r >= 0) ranks[i] = rankOf[r];
            else if (r == int.MinValue) ranks[i] = keys.Length;
        }
        return new KeyRanks(ranks, keys.Length + (anyNaN ? 1 : 0), anyNaN);
    }

    /// <summary>Distinct values beyond which hashing gives way to a radix sort (nearly every value distinct).</summary>
    private static int HashLimit(int n) => Math.Max(1 << 16, n >> 4);

    private static KeyRanks RadixLongs(ReadOnlySpan<long> values, Validity validity, int[] ranks)
    {
        var n = values.Length;
        var keys = new ulong[n];
        var rows = new int[n];
        var bits = validity.Bits.Span;
        var off = validity.BitOffset;
        var m = 0;
        for (var i = 0; i < n; i++)
        {
            if (!ValidBits.IsValid(bits, off, i)) { ranks[i] = -1; continue; }
            keys[m] = RadixRanks.OfLong(values[i]);
            rows[m++] = i;
        }
        var distinct = RadixRanks.Rank(keys, rows, m, ranks);
        return new KeyRanks(ranks, distinct, false);
    }

    private static KeyRanks RadixDoubles(ReadOnlySpan<double> values, Validity validity, bool nanIsMissing, int[] ranks)
    {
        var n = values.Length;
        var keys = new ulong[n];
        var rows = new int[n];
        var bits = validity.Bits.Span;
        var off = validity.BitOffset;
        var m = 0;
        var anyNaN = false;
        for (var i = 0; i < n; i++)
        {
            var d = values[i];
            if (!ValidBits.IsValid(bits, off, i) || (nanIsMissing && double.IsNaN(d))) { ranks[i] = -1; continue; }
            if (double.IsNaN(d)) { anyNaN = true; ranks[i] = int.MinValue; continue; }
            keys[m] = RadixRanks.OfDouble(d);
            rows[m++] = i;
        }
        var distinct = RadixRanks.Rank(keys, rows, m, ranks);
        if (anyNaN)
        {
            for (var i = 0; i < n; i++)
                if (ranks[i] == int.MinValue) ranks[i] = distinct;
        }
        return new KeyRanks(ranks, distinct + (anyNaN ? 1 : 0), anyNaN);
    }

    internal static int[] Iota(int n)
    {
        var a = new int[n];
        for (var i = 0; i < n; i++) a[i] = i;
        return a;
    }

    private static int[] Inverse(int[] sortedIds)
    {
        var rankOf = new int[sortedIds.Length];
        for (var r = 0; r < sortedIds.Length; r++) rankOf[sortedIds[r]] = r;
        return rankOf;
    }

    /// <summary>Replaces insertion ids (non-negative entries) by their position in <paramref name="sortedIds"/>.</summary>
    private static void RemapIds(int[] ranks, int[] sortedIds)
    {
        var rankOf = Inverse(sortedIds);
        for (var i = 0; i < ranks.Length; i++)
        {
            var r = ranks[i];
            if (r >= 0) ranks[i] = rankOf[r];
        }
    }

    /// <summary>
    /// The map's ids in byte order of their keys (byte order is code point order for UTF-8): first by a big-endian
    /// 8-byte prefix, zero-padded (integers, cheap to sort and to compare), then each run that shares a prefix by
    /// the full comparison. A smaller padded prefix always means a smaller key, so only the runs need the bytes.
    /// </summary>
    private static int[] SortedIds(Utf8IdMap map)
    {
        var count = map.Count;
        var arena = map.Arena;
        var offsets = map.Offsets;
        var prefixes = new ulong[count];
        for (var id = 0; id < count; id++)
        {
            var key = arena.AsSpan(offsets[id], offsets[id + 1] - offsets[id]);
            var take = Math.Min(8, key.Length);
            ulong p = 0;
            for (var j = 0; j < take; j++) p |= (ulong)key[j] << (56 - 8 * j);
            prefixes[id] = p;
        }
        var ids = Iota(count);
        Array.Sort(prefixes, ids);
        var comparer = new ArenaComparer(arena, offsets);
        for (var start = 0; start < count;)
        {
            var end = start + 1;
            while (end < count && prefixes[end] == prefixes[start]) end++;
            if (end - start > 1) ids.AsSpan(start, end - start).Sort(comparer);
            start = end;
        }
        return ids;
    }

    /// <summary>Orders arena ids by their UTF-8 bytes: byte order is code point order (Unicode Standard §2.5, UTF-8).</summary>
    private readonly struct ArenaComparer(byte[] arena, int[] offsets) : IComparer<int>
    {
        public int Compare(int x, int y) => CodePointOrder.Compare(
            arena.AsSpan(offsets[x], offsets[x + 1] - offsets[x]),
            arena.AsSpan(offsets[y], offsets[y + 1] - offsets[y]));
    }
}
