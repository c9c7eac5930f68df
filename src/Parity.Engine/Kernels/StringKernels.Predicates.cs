using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

public static partial class StringKernels
{
    /// <summary>
    /// <c>contains</c>, <c>starts_with</c>, <c>ends_with</c> (ordinal; on UTF-8 bytes for Arrow storage).
    /// A missing cell (spec §2.2): <c>boxed+nan</c> gives a missing value, so the result is an object column
    /// (and a filter on it is <c>E-MASK-MISSING</c>); <c>arrow+nan</c> gives false; <c>null</c> modes give null.
    /// </summary>
    public static Column Match(StringPredicate predicate, Column s, Column pattern, Mode mode)
    {
        KernelSupport.CheckLength(s, pattern);
        var n = s.Length;
        var result = new bool[n];
        var missing = KernelSupport.MissingFlags(pattern);
        string what = Name(predicate);
        if (s is Utf8Column u)
        {
            var p = AsUtf8(pattern, what);
            missing = KernelSupport.Or(missing, KernelSupport.MissingFlags(u));
            for (var i = 0; i < n; i++)
            {
                if (missing is not null && missing[i]) continue;
                var text = u.GetBytes(i);
                var find = p.GetBytes(i);
                result[i] = predicate switch
                {
                    StringPredicate.Contains => text.IndexOf(find) >= 0,
                    StringPredicate.StartsWith => text.StartsWith(find),
                    _ => text.EndsWith(find),
                };
            }
            return Finish(result, missing, null, mode);
        }
        if (s is not ObjectColumn o)
        {
            RequireAllMissing(s, what);
            missing = new bool[n];
            missing.AsSpan().Fill(true);
            return Finish(result, missing, null, mode);
        }
        var ps = Strings(pattern, what);
        var cells = o.Cells.Span;
        object?[]? keep = null;
        for (var i = 0; i < n; i++)
        {
            var c = cells[i];
            if (c is string text && ps[i] is { } find)
            {
                result[i] = predicate switch
                {
                    StringPredicate.Contains => text.Contains(find, StringComparison.Ordinal),
                    StringPredicate.StartsWith => text.StartsWith(find, StringComparison.Ordinal),
                    _ => text.EndsWith(find, StringComparison.Ordinal),
                };
                continue;
            }
            missing ??= new bool[n];
            missing[i] = true;
            // boxed+nan keeps the cell's own marker (None stays None, NaN stays NaN).
            keep ??= new object?[n];
            keep[i] = ObjectColumn.IsMissingCell(c, o.Marker) ? c : double.NaN;
        }
        return Finish(result, missing, keep, mode);
    }

    /// <summary>
    /// The same predicate with a literal pattern (what a script's <c>contains(s, 'x')</c> passes): no pattern
    /// column is broadcast. Arrow storage searches the whole data buffer at once; every other case runs the
    /// column overload over a broadcast literal, so the rules stay in one place.
    /// </summary>
    public static Column Match(StringPredicate predicate, Column s, Value pattern, Mode mode)
    {
        if (s is Utf8Column u && pattern.Kind == ValueKind.String && (mode.IsNull || mode.IsArrow))
        {
            var n = u.Length;
            var find = System.Text.Encoding.UTF8.GetBytes(pattern.String);
            bool[] result;
            if (find.Length == 0)
            {
                result = GC.AllocateUninitializedArray<bool>(n);
                result.AsSpan().Fill(true);
            }
            else if (predicate == StringPredicate.Contains)
            {
                result = new bool[n];
                Utf8Scans.Contains(u, find, result);
            }
            else
            {
                result = GC.AllocateUninitializedArray<bool>(n);
                Utf8Scans.Affix(u, find, predicate == StringPredicate.StartsWith, result);
            }
            return Utf8Result(u, result, false, mode);
        }
        return Match(predicate, s, Broadcast.Literal(pattern, s.Length, mode), mode);
    }

    /// <summary>
    /// A bool result over an Arrow column's rows: under <c>null</c> the input's validity (copied); under
    /// <c>arrow+nan</c> a missing row gets <paramref name="missingValue"/> and no bitmap.
    /// </summary>
    internal static Column Utf8Result(Utf8Column u, bool[] result, bool missingValue, Mode mode)
    {
        if (!Utf8Scans.HasMissing(u)) return new BoolColumn(result, mode.Missing);
        var validity = Utf8Scans.CopyValidity(u);
        if (mode.IsNull) return new BoolColumn(result, validity, mode.Missing);
        Utf8Scans.FillMissing(validity, result, missingValue);
        return new BoolColumn(result, mode.Missing);
    }

    public static string Name(StringPredicate predicate) => predicate switch
    {
        StringPredicate.Contains => "contains",
        StringPredicate.StartsWith => "starts_with",
        _ => "ends_with",
    };

    private static Column Finish(bool[] result, bool[]? missing, object?[]? markers, Mode mode)
    {
        if (missing is null) return new BoolColumn(result, mode.Missing);
        if (mode.IsNull) return new BoolColumn(result, KernelSupport.ValidityOf(missing), mode.Missing);
        if (mode.IsArrow)
        {
            // arrow+nan: a missing cell does not match.
            for (var i = 0; i < result.Length; i++) if (missing[i]) result[i] = false;
            return new BoolColumn(result, mode.Missing);
        }
        var cells = new object?[result.Length];
        object t = true, f = false, nan = double.NaN;
        for (var i = 0; i < cells.Length; i++)
            cells[i] = missing[i] ? (markers is null ? nan : markers[i]) : result[i] ? t : f;
        return new ObjectColumn(cells, mode.Missing);
    }
}
