using System.Buffers;
using System.Text;
using Parity.Engine.Columns;

namespace Parity.Harness.Diffing.Internal;

/// <summary>
/// The fast pass of the differ: walks two columns' buffers and collects the rows that may differ; rows it
/// skips are certainly the same under <c>ModeDiffer</c>'s exact rules (same value and same missing marker).
/// Typed loops over spans, no per-cell allocation; pairs it does not know go through the generic path whole.
/// </summary>
internal static class CellScan
{
    /// <summary>Rows per bulk test: a block whose buffers are byte-equal is skipped without looking at cells.</summary>
    private const int Block = 4096;

    /// <summary>Adds every row of [0, rows) that is not provably the same to <paramref name="candidates"/>.</summary>
    public static void Candidates(Column a, Column b, int rows, List<int> candidates)
    {
        var bulk = BlockEquality.For(a, b);
        if (bulk is null)
        {
            Candidates(a, b, 0, rows, candidates);
            return;
        }
        for (var start = 0; start < rows; start += Block)
        {
            var count = Math.Min(Block, rows - start);
            if (!bulk.Same(start, count)) Candidates(a, b, start, start + count, candidates);
        }
    }

    /// <summary>The typed, row-by-row pass over rows [from, to).</summary>
    private static void Candidates(Column a, Column b, int from, int to, List<int> candidates)
    {
        switch (a, b)
        {
            case (Int64Column x, Int64Column y): Same(x.Span, x.Validity, y.Span, y.Validity, a.Marker == b.Marker, from, to, candidates); return;
            case (TimestampColumn x, TimestampColumn y): Same(x.Span, x.Validity, y.Span, y.Validity, a.Marker == b.Marker, from, to, candidates); return;
            case (BoolColumn x, BoolColumn y): Same(x.Span, x.Validity, y.Span, y.Validity, a.Marker == b.Marker, from, to, candidates); return;
            case (Float64Column x, Float64Column y): Floats(x, y, from, to, candidates); return;
            case (Int64Column x, Float64Column y): IntFloat(x, y, from, to, candidates); return;
            case (Float64Column x, Int64Column y): IntFloat(y, x, from, to, candidates); return;
            case (Utf8Column x, Utf8Column y): Utf8(x, y, from, to, candidates); return;
            case (ObjectColumn x, Utf8Column y): ObjectUtf8(x, y, from, to, candidates); return;
            case (Utf8Column x, ObjectColumn y): ObjectUtf8(y, x, from, to, candidates); return;
            case (ObjectColumn x, ObjectColumn y): Objects(x, y, from, to, candidates); return;
            default:
                for (var r = from; r < to; r++) candidates.Add(r);
                return;
        }
    }

    private static void Same<T>(ReadOnlySpan<T> x, Validity vx, ReadOnlySpan<T> y, Validity vy, bool sameMarker, int from, int to, List<int> candidates)
        where T : unmanaged, IEquatable<T>
    {
        x = x[..to];
        y = y[..to];
        var bitmaps = vx.HasBitmap || vy.HasBitmap;
        for (var r = from; r < x.Length; r++)
        {
            if (!bitmaps)
            {
                if (x[r].Equals(y[r])) continue;
                candidates.Add(r);
                continue;
            }
            var ax = vx.IsValid(r);
            var ay = vy.IsValid(r);
            if (ax && ay && x[r].Equals(y[r])) continue;
            if (!ax && !ay && sameMarker) continue;
            candidates.Add(r);
        }
    }

    private static void Floats(Float64Column a, Float64Column b, int from, int to, List<int> candidates)
    {
        var x = a.Span[..to];
        var y = b.Span[..to];
        var sameMarker = a.Marker == b.Marker;
        for (var r = from; r < x.Length; r++)
        {
            var ax = a.Validity.IsValid(r);
            var ay = b.Validity.IsValid(r);
            if (ax && ay)
            {
                if (x[r] == y[r]) continue;
                // Both NaN under one marker: both the sentinel (nan) or both NaN values (null).
                if (sameMarker && double.IsNaN(x[r]) && double.IsNaN(y[r])) continue;
            }
            else if (!ax && !ay && sameMarker)
            {
                continue;
            }
            candidates.Add(r);
        }
    }

    private static void IntFloat(Int64Column a, Float64Column b, int from, int to, List<int> candidates)
    {
        var x = a.Span[..to];
        var y = b.Span[..to];
        for (var r = from; r < x.Length; r++)
        {
            if (a.Validity.IsValid(r) && b.Validity.IsValid(r))
            {
                var d = y[r];
                if (d >= -9.2233720368547758E18 && d < 9.2233720368547758E18 && Math.Floor(d) == d && (long)d == x[r]) continue;
            }
            candidates.Add(r);
        }
    }

    private static void Utf8(Utf8Column a, Utf8Column b, int from, int to, List<int> candidates)
    {
        var sameMarker = a.Marker == b.Marker;
        var oa = a.Offsets;
        var ob = b.Offsets;
        var da = a.Data;
        var db = b.Data;
        for (var r = from; r < to; r++)
        {
            var ma = a.IsMissing(r);
            var mb = b.IsMissing(r);
            if (!ma && !mb && da[oa[r]..oa[r + 1]].SequenceEqual(db[ob[r]..ob[r + 1]])) continue;
            if (ma && mb && sameMarker) continue;
            candidates.Add(r);
        }
    }

    private static void ObjectUtf8(ObjectColumn a, Utf8Column b, int from, int to, List<int> candidates)
    {
        var cells = a.Cells.Span;
        var offsets = b.Offsets;
        var data = b.Data;
        var buffer = ArrayPool<char>.Shared.Rent(256);
        try
        {
            for (var r = from; r < to; r++)
            {
                if (cells[r] is string s && !b.IsMissing(r))
                {
                    var bytes = data[offsets[r]..offsets[r + 1]];
                    if (bytes.Length >= s.Length && bytes.Length <= 3 * s.Length)
                    {
                        if (buffer.Length < bytes.Length)
                        {
                            ArrayPool<char>.Shared.Return(buffer);
                            buffer = ArrayPool<char>.Shared.Rent(bytes.Length);
                        }
                        var n = Encoding.UTF8.GetChars(bytes, buffer);
                        if (buffer.AsSpan(0, n).SequenceEqual(s)) continue;
                    }
                }
                candidates.Add(r);
            }
        }
        finally
        {
            ArrayPool<char>.Shared.Return(buffer);
        }
    }

    private static void Objects(ObjectColumn a, ObjectColumn b, int from, int to, List<int> candidates)
    {
        var x = a.Cells.Span;
        var y = b.Cells.Span;
        var sameMarker = a.Marker == b.Marker;
        for (var r = from; r < to; r++)
        {
            var cx = x[r];
            var cy = y[r];
            if (cx is string sx && cy is string sy && string.Equals(sx, sy, StringComparison.Ordinal)) continue;
            if (cx is null && cy is null && sameMarker) continue;
            candidates.Add(r);
        }
    }
}
