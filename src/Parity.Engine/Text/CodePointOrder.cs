namespace Parity.Engine.Text;

/// <summary>
/// String order by Unicode code point (spec §2.2 "Ordering"). For UTF-8 this is plain byte order; for
/// UTF-16 it is not: a surrogate (U+D800..U+DFFF, the halves of a code point above U+FFFF) must sort after
/// U+E000..U+FFFF, so the first differing units are remapped before comparing (Unicode Standard, §5.17
/// "Binary Order", UTF-16 code point order fix-up).
/// </summary>
public static class CodePointOrder
{
    public static int Compare(ReadOnlySpan<byte> a, ReadOnlySpan<byte> b) => a.SequenceCompareTo(b);

    public static int Compare(ReadOnlySpan<char> a, ReadOnlySpan<char> b)
    {
        var i = a.CommonPrefixLength(b);
        if (i == a.Length || i == b.Length) return a.Length.CompareTo(b.Length);
        return Fix(a[i]).CompareTo(Fix(b[i]));
    }

    public static int Compare(string? a, string? b) => Compare(a.AsSpan(), b.AsSpan());

    private static int Fix(char c) => c >= '\uE000' ? c - 0x800 : c >= '\uD800' ? c + 0x2000 : c;

    /// <summary>An <see cref="IComparer{T}"/> over strings in code point order.</summary>
    public static IComparer<string> Comparer { get; } = Comparer<string>.Create(Compare);
}
