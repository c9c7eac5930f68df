using Parity.Engine.Columns;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.Kernels;

/// <summary>
/// The literal (scalar) overloads and the whole-buffer Arrow passes must give exactly the column the
/// broadcast path gives: same type, same values, same missing markers, in every mode; on missing cells,
/// non-ASCII text, empty strings and slices whose offsets do not start at zero.
/// </summary>
public sealed class LiteralFastPathTests
{
    public static TheoryData<string> Modes => new() { "legacy", "modern", "arrow+nan+alias", "boxed+null+cow", "arrow+null+alias", "boxed+nan+cow" };

    // Latin with accents, Greek, CJK, an emoji outside the BMP (four UTF-8 bytes), empty and missing cells.
    private static readonly object?[] Cells =
    [
        "Zoë", "Σοφία", "", null, "山田 花子", "🚢 ferry", "xyz", "axyzb", "xy", "zë", null, "Zoë", "🚢", "ë", "abcxyz",
        "ferry xyz ferry xyz", "x", "yz", "xyzxyz", "", "Zoë 🚢",
    ];

    private static readonly string[] Patterns = ["xyz", "ë", "🚢", "", "Zoë", "ferry", "zx", "Zoë 🚢 long pattern"];

    private static IEnumerable<Column> Inputs(Mode mode)
    {
        var full = K.Col(mode, Cells);
        yield return full;
        // Slices: offsets stay absolute into the parent's data buffer, the bitmap starts mid-byte.
        yield return full.Slice(3, 12);
        yield return full.Slice(5, 9);
        yield return full.Slice(1, 0);
        // A column with no missing cell at all (no bitmap).
        yield return K.Col(mode, "Zoë", "xyz", "", "山田", "🚢🚢");
    }

    private static void AssertSame(Column expected, Column actual)
    {
        Assert.Equal(expected.TypeLabel, actual.TypeLabel);
        Assert.Equal(expected.Length, actual.Length);
        Assert.Equal(K.Values(expected), K.Values(actual));
    }

    // Spec §2.2 string predicates on missing cells; ordinal (byte) matching as .NET's ordinal Contains/StartsWith/EndsWith.
    [Theory]
    [MemberData(nameof(Modes))]
    public void Match_with_literal_equals_broadcast(string m)
    {
        var mode = Mode.Parse(m);
        foreach (var s in Inputs(mode))
        {
            foreach (var p in Patterns)
            {
                foreach (var predicate in new[] { StringPredicate.Contains, StringPredicate.StartsWith, StringPredicate.EndsWith })
                {
                    var expected = StringKernels.Match(predicate, s, Broadcast.Literal(Value.Of(p), s.Length, mode), mode);
                    AssertSame(expected, StringKernels.Match(predicate, s, Value.Of(p), mode));
                }
            }
        }
    }

    // Spec §2.2: a missing pattern (the null literal) follows the broadcast rules too.
    [Theory]
    [MemberData(nameof(Modes))]
    public void Match_with_null_literal_equals_broadcast(string m)
    {
        var mode = Mode.Parse(m);
        var s = K.Col(mode, Cells);
        var expected = StringKernels.Match(StringPredicate.Contains, s, Broadcast.Literal(Value.Null, s.Length, mode), mode);
        AssertSame(expected, StringKernels.Match(StringPredicate.Contains, s, Value.Null, mode));
    }

    // Spec §2.2 comparisons with a missing operand; string order is code point order (Unicode Standard §2.5: UTF-8 byte order).
    [Theory]
    [MemberData(nameof(Modes))]
    public void String_compare_with_literal_equals_broadcast(string m)
    {
        var mode = Mode.Parse(m);
        foreach (var s in Inputs(mode))
        {
            foreach (var p in Patterns)
            {
                foreach (var op in Enum.GetValues<ComparisonOp>())
                {
                    var lit = Broadcast.Literal(Value.Of(p), s.Length, mode);
                    AssertSame(Comparison.Compare(op, s, lit, mode), Comparison.Compare(op, s, Value.Of(p), mode));
                    AssertSame(Comparison.Compare(op, lit, s, mode), Comparison.Compare(op, Value.Of(p), s, mode));
                }
            }
        }
    }

    // IEEE 754: NaN is unordered (only <> is true); -0.0 equals 0.0. Spec §2.2: missing operands per marker.
    [Theory]
    [MemberData(nameof(Modes))]
    public void Numeric_compare_with_literal_equals_broadcast(string m)
    {
        var mode = Mode.Parse(m);
        var floats = K.Col(mode, 1.5, null, -0.0, 0.0, double.PositiveInfinity, 3.0, -2.5, null, 7.25);
        var ints = K.Col(mode, 3L, null, 0L, -4L, long.MaxValue, long.MinValue, 3L);
        var intsNoMissing = K.Col(mode, 3L, 0L, -4L, 9_007_199_254_740_993L);
        var nanValues = new Float64Column(new[] { 1.0, double.NaN, 0.0, -1.0 }, mode.Missing);
        Value[] literals = [Value.Of(3L), Value.Of(0.0), Value.Of(-0.0), Value.Of(3.0), Value.Of(-2.5), Value.Of(9_007_199_254_740_992.0), Value.Null, Value.Of(double.NaN)];
        foreach (var c in new[] { floats, ints, intsNoMissing, nanValues, floats.Slice(1, 6), ints.Slice(1, 5) })
        {
            foreach (var lit in literals)
            {
                foreach (var op in Enum.GetValues<ComparisonOp>())
                {
                    var column = Broadcast.Literal(lit, c.Length, mode);
                    AssertSame(Comparison.Compare(op, c, column, mode), Comparison.Compare(op, c, lit, mode));
                    AssertSame(Comparison.Compare(op, column, c, mode), Comparison.Compare(op, lit, c, mode));
                }
            }
        }
    }

    // Spec §2.2: length counts code points (Unicode Standard §3.9); slices and missing cells as the boxed path counts them.
    [Theory]
    [MemberData(nameof(Modes))]
    public void Length_whole_buffer_matches_boxed_counts(string m)
    {
        var mode = Mode.Parse(m);
        var boxedMode = new Mode(StringStorage.Boxed, mode.Missing, mode.Writes);
        var arrowMode = new Mode(StringStorage.Arrow, mode.Missing, mode.Writes);
        var boxed = K.Col(boxedMode, Cells);
        var arrow = K.Col(arrowMode, Cells);
        foreach (var (o, l) in new[] { (0, Cells.Length), (3, 12), (5, 9), (1, 0), (13, 8) })
        {
            var expected = StringKernels.Length(boxed.Slice(o, l), boxedMode);
            AssertSame(expected, StringKernels.Length(arrow.Slice(o, l), arrowMode));
        }
    }

    // Spec §2.2: length of long non-ASCII text (vector-width blocks with continuation bytes crossing row ends).
    [Fact]
    public void Length_of_long_mixed_rows()
    {
        var rng = new Random(3);
        var pieces = new[] { "a", "ë", "Σ", "山", "🚢", " ", "xyz" };
        var cells = new object?[300];
        for (var i = 0; i < cells.Length; i++)
        {
            if (i % 17 == 0) continue;
            var sb = new System.Text.StringBuilder();
            var len = rng.Next(0, 40);
            for (var k = 0; k < len; k++) sb.Append(pieces[rng.Next(pieces.Length)]);
            cells[i] = sb.ToString();
        }
        var arrow = K.Col(Mode.Modern, cells);
        var r = StringKernels.Length(arrow, Mode.Modern);
        for (var i = 0; i < cells.Length; i++)
        {
            if (cells[i] is string s) Assert.Equal(Value.Of(CountRunes(s)), r.GetValue(i));
            else Assert.True(r.IsMissing(i));
        }
    }

    // .NET's Rune enumeration as the independent count of code points.
    private static long CountRunes(string s)
    {
        long n = 0;
        foreach (var _ in s.EnumerateRunes()) n++;
        return n;
    }

    // Spec §2.2 contains: hits found by the whole-buffer search must not leak across row ends ("xy" + "z").
    [Fact]
    public void Contains_does_not_match_across_rows()
    {
        var mode = Mode.Modern;
        var r = StringKernels.Match(StringPredicate.Contains, K.Col(mode, "ax", "yz", "xy", "z", "", "xyz"), Value.Of("xyz"), mode);
        Assert.Equal([Value.Of(false), Value.Of(false), Value.Of(false), Value.Of(false), Value.Of(false), Value.Of(true)], K.Values(r));
    }
}
