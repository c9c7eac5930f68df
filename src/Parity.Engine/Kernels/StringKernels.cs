using System.Text;
using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Text;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary>
/// String functions of spec §3.4 on both storages: Arrow columns are read as UTF-8 spans over the offsets and
/// data buffers (nothing decoded); boxed columns as managed strings. Both give the same results wherever
/// spec §2.2 says the storages agree. Positions and lengths count Unicode code points. In a boxed column a
/// cell that is not a string gives a missing result, as legacy stacks did.
/// </summary>
public static partial class StringKernels
{
    /// <summary><c>length(s)</c>: code points; int64 without missing input, else float64 under <c>nan</c> and int64 with nulls under <c>null</c>.</summary>
    public static Column Length(Column s, Mode mode)
    {
        var n = s.Length;
        if (s is Utf8Column utf8) return LengthUtf8(utf8, mode);
        var data = new long[n];
        bool[]? missing;
        switch (s)
        {
            case ObjectColumn o:
            {
                var cells = o.Cells.Span;
                missing = null;
                for (var i = 0; i < n; i++)
                {
                    if (cells[i] is string str) { data[i] = Utf8Text.CodePointCount(str.AsSpan()); continue; }
                    missing ??= new bool[n];
                    missing[i] = true;
                }
                break;
            }
            default:
                missing = RequireAllMissing(s, "length");
                break;
        }
        return KernelSupport.Int(data, missing, mode);
    }

    /// <summary>
    /// Arrow storage: counts over the whole data buffer (<see cref="Utf8Scans.CodePointCounts"/>), validity
    /// copied as bytes. Same results as the boxed path (spec §2.2 <c>length</c>).
    /// </summary>
    private static Column LengthUtf8(Utf8Column u, Mode mode)
    {
        var n = u.Length;
        var data = GC.AllocateUninitializedArray<long>(n);
        Utf8Scans.CodePointCounts(u, data);
        if (!Utf8Scans.HasMissing(u)) return new Int64Column(data, mode.Missing);
        var validity = Utf8Scans.CopyValidity(u);
        if (mode.IsNull) return new Int64Column(data, validity, mode.Missing);
        // nan: a missing input makes the result float64 with NaN (spec §2.1).
        var d = GC.AllocateUninitializedArray<double>(n);
        var bits = validity.Bits.Span;
        for (var i = 0; i < n; i++) d[i] = (bits[i >> 3] & (1 << (i & 7))) != 0 ? data[i] : double.NaN;
        return new Float64Column(d, mode.Missing);
    }

    public static Column Upper(Column s, Mode mode) => CaseMap(s, mode, upper: true);

    public static Column Lower(Column s, Mode mode) => CaseMap(s, mode, upper: false);

    /// <summary><c>trim(s)</c>: strips leading and trailing Unicode White_Space.</summary>
    public static Column Trim(Column s, Mode mode)
    {
        if (s is Utf8Column u)
        {
            var b = new Utf8ColumnBuilder(u.Length, u.Data.Length);
            for (var i = 0; i < u.Length; i++)
            {
                if (u.IsMissing(i)) { b.AppendMissing(); continue; }
                b.Append(Utf8Text.Trim(u.GetBytes(i)));
            }
            return b.Build(u.Marker);
        }
        return MapBoxed(s, mode, "trim", static str => str.Trim());
    }

    /// <summary>
    /// <c>substring(s, start, count)</c>: code points numbered from 1 as in SQL (ISO/IEC 9075 &lt;character
    /// substring function&gt;): the result covers positions [start, start + count) clipped to the string; a
    /// start below 1 still counts toward the end. A negative count gives the empty string (SQL raises an error).
    /// </summary>
    public static Column Substring(Column s, Column start, Column count, Mode mode)
    {
        var st = Ints(start, "substring");
        var ct = Ints(count, "substring");
        var extra = KernelSupport.Or(KernelSupport.MissingFlags(start), KernelSupport.MissingFlags(count));
        if (s is Utf8Column u)
        {
            var b = new Utf8ColumnBuilder(u.Length, u.Data.Length);
            for (var i = 0; i < u.Length; i++)
            {
                if (u.IsMissing(i) || (extra is not null && extra[i])) { b.AppendMissing(); continue; }
                var (lo, hi) = Range(st[i], ct[i]);
                var bytes = u.GetBytes(i);
                var from = Utf8Text.ByteIndexOfCodePoint(bytes, lo);
                var to = hi <= lo ? from : from + Utf8Text.ByteIndexOfCodePoint(bytes[from..], hi - lo);
                b.Append(bytes[from..to]);
            }
            return b.Build(u.Marker);
        }
        return MapBoxedIndexed(s, mode, "substring", extra, (str, i) =>
        {
            var (lo, hi) = Range(st[i], ct[i]);
            var from = Utf8Text.CharIndexOfCodePoint(str, lo);
            var to = hi <= lo ? from : from + Utf8Text.CharIndexOfCodePoint(str.AsSpan(from), hi - lo);
            return str[from..to];
        });
    }

    /// <summary>0-based code point range [lo, hi) of SQL's SUBSTRING(s FROM start FOR count), before clipping to the length.</summary>
    private static (int Lo, int Hi) Range(long start, long count)
    {
        if (count < 0) return (0, 0);
        var lo = Math.Max(start, 1) - 1;
        var hi = start > long.MaxValue - count ? long.MaxValue : start + count - 1;
        lo = Math.Min(lo, int.MaxValue);
        hi = Math.Clamp(hi, 0, int.MaxValue);
        return ((int)lo, (int)Math.Max(hi, lo));
    }

    /// <summary><c>replace(s, old, new)</c>: every ordinal occurrence; an empty <c>old</c> leaves the string as it is.</summary>
    public static Column Replace(Column s, Column old, Column replacement, Mode mode)
    {
        var extra = KernelSupport.Or(KernelSupport.MissingFlags(old), KernelSupport.MissingFlags(replacement));
        if (s is Utf8Column u)
        {
            var ou = AsUtf8(old, "replace");
            var nu = AsUtf8(replacement, "replace");
            var b = new Utf8ColumnBuilder(u.Length, u.Data.Length);
            for (var i = 0; i < u.Length; i++)
            {
                if (u.IsMissing(i) || (extra is not null && extra[i])) { b.AppendMissing(); continue; }
                var text = u.GetBytes(i);
                var find = ou.GetBytes(i);
                if (find.IsEmpty) { b.Append(text); continue; }
                var with = nu.GetBytes(i);
                var rest = text;
                var first = rest.IndexOf(find);
                if (first < 0) { b.Append(text); continue; }
                // Exact size first: a worst-case estimate overflows int for long replacements.
                long hits = 0;
                for (var scan = text; ;)
                {
                    var at = scan.IndexOf(find);
                    if (at < 0) break;
                    hits++;
                    scan = scan[(at + find.Length)..];
                }
                var dst = b.Reserve(Utf8ColumnBuilder.CheckedSize(text.Length + hits * (with.Length - find.Length)));
                var w = 0;
                for (var at = first; at >= 0; at = rest.IndexOf(find))
                {
                    rest[..at].CopyTo(dst[w..]);
                    w += at;
                    with.CopyTo(dst[w..]);
                    w += with.Length;
                    rest = rest[(at + find.Length)..];
                }
                rest.CopyTo(dst[w..]);
                b.Commit(w + rest.Length);
            }
            return b.Build(u.Marker);
        }
        var os = Strings(old, "replace");
        var ns = Strings(replacement, "replace");
        return MapBoxedIndexed(s, mode, "replace", extra, (str, i) =>
            os[i]!.Length == 0 ? str : str.Replace(os[i]!, ns[i], StringComparison.Ordinal));
    }

    /// <summary><c>a || b</c>: concatenation; a missing operand gives a missing result in every mode. Non-strings concatenate as their <c>text</c>.</summary>
    public static Column Concat(Column left, Column right, Mode mode)
    {
        KernelSupport.CheckLength(left, right);
        var n = left.Length;
        var missing = KernelSupport.Or(KernelSupport.MissingFlags(left), KernelSupport.MissingFlags(right));
        if (left is Utf8Column a && right is Utf8Column c)
        {
            var b = new Utf8ColumnBuilder(n, a.Data.Length + c.Data.Length);
            for (var i = 0; i < n; i++)
            {
                if (missing is not null && missing[i]) { b.AppendMissing(); continue; }
                var x = a.GetBytes(i);
                var y = c.GetBytes(i);
                var dst = b.Reserve(x.Length + y.Length);
                x.CopyTo(dst);
                y.CopyTo(dst[x.Length..]);
                b.Commit(x.Length + y.Length);
            }
            return b.Build(mode.Missing);
        }
        if (mode.IsArrow)
        {
            var b = new Utf8ColumnBuilder(n, n * 8);
            for (var i = 0; i < n; i++)
            {
                if (missing is not null && missing[i]) { b.AppendMissing(); continue; }
                b.Append(TextOf(left, i) + TextOf(right, i));
            }
            return b.Build(mode.Missing);
        }
        var cells = new object?[n];
        var gone = KernelSupport.MissingStringCell(mode);
        for (var i = 0; i < n; i++)
            cells[i] = missing is not null && missing[i] ? gone : string.Concat(TextOf(left, i), TextOf(right, i));
        return new ObjectColumn(cells, mode.Missing);
    }

    private static string TextOf(Column c, int i) => c switch
    {
        Utf8Column u => u.GetString(i),
        ObjectColumn o when o.Cells.Span[i] is string s => s,
        _ => ValueText.Format(c.GetValue(i)),
    };

    private static Column CaseMap(Column s, Mode mode, bool upper)
    {
        if (s is Utf8Column u)
        {
            var n = u.Length;
            ReadOnlySpan<int> off = u.Offsets;
            var bytes = u.Data;
            if (n > 0 && Utf8Text.IsAscii(bytes[off[0]..off[n]]))
            {
                // All-ASCII fast path: same offsets, bytes mapped in one pass.
                var start = off[0];
                var src = bytes[start..off[n]];
                var dst = new byte[src.Length];
                if (upper) Ascii.ToUpper(src, dst, out _);
                else Ascii.ToLower(src, dst, out _);
                var offsets = new int[n + 1];
                for (var i = 0; i <= n; i++) offsets[i] = off[i] - start;
                return Utf8ColumnBuilder.FromBuffers(offsets, dst, CopyValidity(u), u.Marker);
            }
            var b = new Utf8ColumnBuilder(n, bytes.Length);
            for (var i = 0; i < n; i++)
            {
                if (u.IsMissing(i)) { b.AppendMissing(); continue; }
                var cell = u.GetBytes(i);
                var dst = b.Reserve(cell.Length * CaseMapping.MaxUtf8Growth);
                b.Commit(upper ? CaseMapping.ToUpper(cell, dst) : CaseMapping.ToLower(cell, dst));
            }
            return b.Build(u.Marker);
        }
        return upper
            ? MapBoxed(s, mode, "upper", CaseMapping.ToUpper)
            : MapBoxed(s, mode, "lower", CaseMapping.ToLowerFinalSigma); // boxed only (docs/semantics.md)
    }

    private static Validity CopyValidity(Utf8Column u)
    {
        var m = KernelSupport.MissingFlags(u);
        return m is null ? Validity.AllValid(u.Length) : KernelSupport.ValidityOf(m);
    }

    private static Column MapBoxed(Column s, Mode mode, string what, Func<string, string> map) =>
        MapBoxedIndexed(s, mode, what, null, (str, _) => map(str));

    /// <summary>
    /// Applies <paramref name="map"/> to each string cell of a boxed column. A missing cell keeps its marker
    /// (None stays None); a non-string cell or a missing extra argument gives the mode's missing string.
    /// </summary>
    private static Column MapBoxedIndexed(Column s, Mode mode, string what, bool[]? extraMissing, Func<string, int, string> map)
    {
        var n = s.Length;
        if (s is not ObjectColumn o)
        {
            RequireAllMissing(s, what);
            return Broadcast.Missing(n, mode);
        }
        var src = o.Cells.Span;
        var cells = new object?[n];
        var gone = KernelSupport.MissingStringCell(mode);
        for (var i = 0; i < n; i++)
        {
            var c = src[i];
            if (ObjectColumn.IsMissingCell(c, o.Marker)) cells[i] = c;
            else if (c is string str && (extraMissing is null || !extraMissing[i])) cells[i] = map(str, i);
            else cells[i] = gone;
        }
        return new ObjectColumn(cells, o.Marker);
    }

    /// <summary>Missing flags of a non-string column that is entirely missing (a <c>null</c> argument); anything else is <c>E-TYPE</c>.</summary>
    private static bool[] RequireAllMissing(Column s, string what)
    {
        if (s.Length > 0 && !KernelSupport.AllMissing(s)) throw KernelSupport.TypeError(what, s);
        var m = new bool[s.Length];
        m.AsSpan().Fill(true);
        return m;
    }

    private static long[] Ints(Column c, string what)
    {
        var r = new long[c.Length];
        if (c is Int64Column ic) { ic.Span.CopyTo(r); return r; }
        if (KernelSupport.AllMissing(c)) return r;
        if (c is Float64Column or ObjectColumn)
        {
            for (var i = 0; i < r.Length; i++)
            {
                var v = c.GetValue(i);
                if (v.IsMissing) continue;
                if (v.Kind == ValueKind.Int64) { r[i] = v.Int64; continue; }
                if (v.Kind == ValueKind.Float64 && v.Float64 == Math.Floor(v.Float64) && Math.Abs(v.Float64) < 9e18) { r[i] = (long)v.Float64; continue; }
                throw KernelSupport.TypeError(what + " position", c);
            }
            return r;
        }
        throw KernelSupport.TypeError(what + " position", c);
    }

    /// <summary>A Utf8 view of an argument column (an all-missing argument becomes an all-missing string column).</summary>
    internal static Utf8Column AsUtf8(Column c, string what)
    {
        if (c is Utf8Column u) return u;
        if (KernelSupport.AllMissing(c) || (c is ObjectColumn o && o.IsStringsOnly))
        {
            var b = new Utf8ColumnBuilder(c.Length, 16);
            for (var i = 0; i < c.Length; i++)
            {
                if (c.IsMissing(i)) b.AppendMissing();
                else b.Append(((ObjectColumn)c).GetString(i));
            }
            return b.Build(c.Marker);
        }
        throw KernelSupport.TypeError(what, c);
    }

    /// <summary>Managed strings of an argument column (null where missing).</summary>
    internal static string?[] Strings(Column c, string what)
    {
        var r = new string?[c.Length];
        if (KernelSupport.AllMissing(c)) return r;
        if (c is Utf8Column u)
        {
            for (var i = 0; i < r.Length; i++) r[i] = u.IsMissing(i) ? null : u.GetString(i);
            return r;
        }
        if (c is ObjectColumn o && o.IsStringsOnly)
        {
            var cells = o.Cells.Span;
            for (var i = 0; i < r.Length; i++) r[i] = cells[i] as string;
            return r;
        }
        throw KernelSupport.TypeError(what, c);
    }
}
