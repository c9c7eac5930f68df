using System.Globalization;
using System.Text;
using Parity.Engine.Columns;
using Parity.Engine.Errors;

namespace Parity.Script.Running.Internal;

/// <summary>
/// Enforces <see cref="RunOptions.MaxStringBytes"/> before the kernels that grow strings (<c>||</c> and a
/// <c>replace</c> whose new text is longer than the old) allocate, and after the ones whose growth is bounded
/// (case mapping, string <c>sum</c>). Checking first matters: a doubling <c>||</c> chain or a multiplying
/// <c>replace</c> would otherwise exhaust memory before any result existed to measure.
/// </summary>
internal static class StringBudget
{
    /// <summary>Numbers, booleans and timestamps concatenate as their text, which is never longer than this.</summary>
    private const long NonStringBytes = 40;

    /// <summary>Throws E-LIMIT when some row of <c>left || right</c> would exceed <paramref name="limit"/> bytes.</summary>
    public static void CheckConcat(Column left, Column right, long limit)
    {
        var n = Math.Min(left.Length, right.Length);
        for (var i = 0; i < n; i++)
        {
            var total = UpperBytes(left, i) + UpperBytes(right, i);
            if (total <= limit) continue;
            total = Bytes(left, i) + Bytes(right, i);
            if (total > limit) throw TooLong(total, limit, "'||'");
        }
    }

    /// <summary>Throws E-LIMIT when some row of <c>replace(s, old, new)</c> would exceed <paramref name="limit"/> bytes.</summary>
    public static void CheckReplace(Column s, Column old, Column replacement, long limit)
    {
        if (s is not IStringColumn strings || old is not IStringColumn olds || replacement is not IStringColumn news) return;
        var n = Math.Min(s.Length, Math.Min(old.Length, replacement.Length));
        for (var i = 0; i < n; i++)
        {
            if (s.IsMissing(i) || old.IsMissing(i) || replacement.IsMissing(i)) continue;
            if (!IsString(old, i) || !IsString(replacement, i) || !IsString(s, i)) continue;
            var o = olds.GetString(i);
            var w = news.GetString(i);
            if (o.Length == 0 || Encoding.UTF8.GetByteCount(w) <= Encoding.UTF8.GetByteCount(o)) continue;
            var text = strings.GetString(i);
            long count = 0;
            for (var at = text.IndexOf(o, StringComparison.Ordinal); at >= 0; at = text.IndexOf(o, at + o.Length, StringComparison.Ordinal))
                count++;
            if (count == 0) continue;
            var total = Encoding.UTF8.GetByteCount(text) + count * (Encoding.UTF8.GetByteCount(w) - (long)Encoding.UTF8.GetByteCount(o));
            if (total > limit) throw TooLong(total, limit, "replace");
        }
    }

    /// <summary>Throws E-LIMIT when a cell of a computed string column exceeds <paramref name="limit"/> bytes.</summary>
    public static void CheckResult(Column result, long limit, string what)
    {
        for (var i = 0; i < result.Length; i++)
        {
            if (UpperBytes(result, i) <= limit) continue;
            var bytes = Bytes(result, i);
            if (bytes > limit) throw TooLong(bytes, limit, what);
        }
    }

    private static bool IsString(Column c, int i) => c is Utf8Column || (c is ObjectColumn o && o.Cells.Span[i] is string);

    /// <summary>A cheap upper bound of the UTF-8 bytes of cell <paramref name="i"/> (3 bytes per UTF-16 unit at most).</summary>
    private static long UpperBytes(Column c, int i) => c switch
    {
        Utf8Column u => u.Offsets[i + 1] - u.Offsets[i],
        ObjectColumn o => o.Cells.Span[i] is string s ? 3L * s.Length : NonStringBytes,
        _ => NonStringBytes,
    };

    private static long Bytes(Column c, int i) => c switch
    {
        Utf8Column u => u.Offsets[i + 1] - u.Offsets[i],
        ObjectColumn o => o.Cells.Span[i] is string s ? Encoding.UTF8.GetByteCount(s) : NonStringBytes,
        _ => NonStringBytes,
    };

    private static EngineException TooLong(long bytes, long limit, string what) =>
        new(ErrorCodes.Limit, string.Create(CultureInfo.InvariantCulture,
            $"{what} would make a string of {bytes} bytes, more than the limit of {limit} bytes (raise it with --max-string-bytes N)"));
}
