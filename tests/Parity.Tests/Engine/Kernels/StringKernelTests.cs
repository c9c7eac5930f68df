using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.Kernels;

public sealed class StringKernelTests
{
    public static TheoryData<string> Modes => new() { "legacy", "modern", "arrow+nan+alias", "boxed+null+cow" };

    // Spec §2.2: length counts code points in every mode; "🚢" is one code point, two UTF-16 units, four UTF-8 bytes (Unicode Standard §3.9).
    [Theory]
    [MemberData(nameof(Modes))]
    public void Length_counts_code_points(string m)
    {
        var mode = Mode.Parse(m);
        var r = StringKernels.Length(K.Col(mode, "Ola 🚢", "Weiß", "山田 花子", ""), mode);
        Assert.Equal("int64", r.TypeLabel);
        Assert.Equal([Value.Of(5L), Value.Of(4L), Value.Of(5L), Value.Of(0L)], K.Values(r));
    }

    // Spec §2.2: with missing input length is float64 under nan and int64 with nulls under null.
    [Theory]
    [InlineData("legacy", "float64", MissingKind.NaN)]
    [InlineData("arrow+nan+cow", "float64", MissingKind.NaN)]
    [InlineData("modern", "int64", MissingKind.Null)]
    [InlineData("boxed+null+alias", "int64", MissingKind.Null)]
    public void Length_with_missing(string m, string type, MissingKind kind)
    {
        var mode = Mode.Parse(m);
        var r = StringKernels.Length(K.Col(mode, "bike", null), mode);
        Assert.Equal(type, r.TypeLabel);
        Assert.Equal(4.0, r.GetValue(0).AsDouble);
        Assert.Equal(kind, r.GetValue(1).Missing);
    }

    // Unicode full case mapping (SpecialCasing.txt, unconditional): U+00DF ß -> "SS", U+FB01 ﬁ -> "FI", U+0390 -> U+0399 U+0308 U+0301, U+0130 -> "i\u0307".
    [Theory]
    [MemberData(nameof(Modes))]
    public void Full_case_mapping(string m)
    {
        var mode = Mode.Parse(m);
        var up = StringKernels.Upper(K.Col(mode, "Jörg Weiß", "ﬁsh", "\u0390", "σοφία", "abc"), mode);
        Assert.Equal(["JÖRG WEISS", "FISH", "\u0399\u0308\u0301", "ΣΟΦΊΑ", "ABC"], Strings(up));
        var low = StringKernels.Lower(K.Col(mode, "\u0130stanbul", "ÅSA", "🚢X"), mode);
        Assert.Equal(["i\u0307stanbul", "åsa", "🚢x"], Strings(low));
    }

    // SQL SUBSTRING (ISO/IEC 9075): positions from 1, counted in code points; a start below 1 still counts toward the end.
    [Theory]
    [MemberData(nameof(Modes))]
    public void Substring_counts_code_points_from_one(string m)
    {
        var mode = Mode.Parse(m);
        var s = K.Col(mode, "Ola 🚢 ferry", "Ola 🚢 ferry", "abc", "abc", "abc");
        var r = StringKernels.Substring(s, K.Col(mode, 5, 1, 0, 3, 2), K.Col(mode, 1, 3, 2, 10, -1), mode);
        Assert.Equal(["🚢", "Ola", "a", "c", ""], Strings(r));
    }

    [Theory]
    [MemberData(nameof(Modes))]
    public void Trim_replace_concat(string m)
    {
        var mode = Mode.Parse(m);
        Assert.Equal(["bike", "x y"], Strings(StringKernels.Trim(K.Col(mode, "  bike\u00A0", "\tx y\u2003"), mode)));
        Assert.Equal(["🚢 🚢 pass", "abc"], Strings(StringKernels.Replace(K.Col(mode, "boat boat pass", "abc"), K.Col(mode, "boat", ""), K.Col(mode, "🚢", "z"), mode)));
        // Spec §2.2: a || b with a missing operand is missing in every mode.
        var c = StringKernels.Concat(K.Col(mode, "Zoë", "Ola", null), K.Col(mode, " B", null, "x"), mode);
        Assert.Equal("Zoë B", c.GetValue(0).String);
        Assert.True(c.IsMissing(1));
        Assert.True(c.IsMissing(2));
    }

    // Spec §2.2: string predicates on a missing cell: boxed+nan gives a missing value (object column), arrow+nan false, null modes null.
    [Theory]
    [InlineData("legacy", "object")]
    [InlineData("boxed+nan+cow", "object")]
    [InlineData("arrow+nan+alias", "bool")]
    [InlineData("modern", "bool")]
    [InlineData("boxed+null+cow", "bool")]
    public void Predicates_on_missing(string m, string type)
    {
        var mode = Mode.Parse(m);
        var s = K.Col(mode, "window seat", null, "bike");
        foreach (var (p, pattern, first) in new[] { (StringPredicate.Contains, "seat", true), (StringPredicate.StartsWith, "win", true), (StringPredicate.EndsWith, "ke", false) })
        {
            var r = StringKernels.Match(p, s, K.Col(mode, pattern, pattern, pattern), mode);
            Assert.Equal(type, r.TypeLabel);
            Assert.Equal(Value.Of(first), r.GetValue(0));
            var missing = r.GetValue(1);
            if (mode.IsNull) Assert.Equal(MissingKind.Null, missing.Missing);
            else if (mode.IsArrow) Assert.Equal(Value.Of(false), missing);
            else Assert.True(missing.IsMissing);
        }
    }

    // Spec §2.2: text(x): under boxed+nan a missing value becomes 'nan'; otherwise it stays missing. Spec §2.3: floats keep a fractional digit, bools true/false.
    [Theory]
    [MemberData(nameof(Modes))]
    public void Text_rule(string m)
    {
        var mode = Mode.Parse(m);
        var r = Casts.Text(K.Col(mode, 3.0, 0.1, null), mode);
        Assert.Equal("3.0", r.GetValue(0).String);
        Assert.Equal("0.1", r.GetValue(1).String);
        if (mode.IsBoxed && mode.IsNan) Assert.Equal(Value.Of("nan"), r.GetValue(2));
        else Assert.True(r.IsMissing(2));
        Assert.Equal(["true", "false"], Strings(Casts.Text(K.Col(mode, true, false), mode)));
        Assert.Equal(mode.IsArrow ? "utf8" : "object", r.TypeLabel);
    }

    // Spec §2.2: type_of gives the label in that mode ('object' under boxed, 'utf8' under arrow for strings).
    [Fact]
    public void Type_of()
    {
        Assert.Equal("object", Functions.TypeOf(K.Col(Mode.Legacy, "a"), Mode.Legacy).GetValue(0).String);
        Assert.Equal("utf8", Functions.TypeOf(K.Col(Mode.Modern, "a"), Mode.Modern).GetValue(0).String);
    }

    // Spec §2.2: cast to int64 with a missing value is E-CAST under nan and keeps nulls under null; same-type casts share the column.
    [Fact]
    public void Casts_to_int()
    {
        var legacy = K.Col(Mode.Legacy, 1.0, null);
        Assert.Equal(ErrorCodes.Cast, Assert.Throws<EngineException>(() => Casts.Cast(legacy, ColumnType.Int64, Mode.Legacy)).Code);
        var modern = Casts.Cast(K.Col(Mode.Modern, 1.0, null), ColumnType.Int64, Mode.Modern);
        Assert.Equal("int64", modern.TypeLabel);
        Assert.Equal(MissingKind.Null, modern.GetValue(1).Missing);
        var same = K.Col(Mode.Modern, 1, 2);
        Assert.Same(same, Casts.Cast(same, ColumnType.Int64, Mode.Modern));
        Assert.Equal(ErrorCodes.Cast, Assert.Throws<EngineException>(() => Casts.Cast(K.Col(Mode.Modern, "x1"), ColumnType.Int64, Mode.Modern)).Code);
        Assert.Equal([Value.Of(12L)], K.Values(Casts.Cast(K.Col(Mode.Modern, "12"), ColumnType.Int64, Mode.Modern)));
    }

    private static string[] Strings(Column c)
    {
        var s = new string[c.Length];
        for (var i = 0; i < s.Length; i++) s[i] = c.GetValue(i).String;
        return s;
    }
}
