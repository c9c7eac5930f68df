using Parity.Engine.Values;
using Parity.Harness.Formatting;

namespace Parity.Tests.Harness;

public sealed class CellTextTests
{
    public static TheoryData<string, string> Cases()
    {
        // Spec §2.3: floats in shortest round-trip form with a fractional digit, bools true/false,
        // timestamps ISO 8601 with Z; spec §5: NaN, None and null told apart.
        var d = new TheoryData<string, string>
        {
            { "int", "42" },
            { "negint", "-7" },
            { "float", "3.0" },
            { "float2", "0.1" },
            { "floatexp", "1.0E+20" },
            { "negzero", "-0.0" },
            { "nanvalue", "float:NaN" },
            { "inf", "float:Infinity" },
            { "neginf", "float:-Infinity" },
            { "true", "true" },
            { "nan", "NaN" },
            { "none", "None" },
            { "null", "null" },
            { "nat", "NaT" },
            { "ts", "2026-06-01T08:30:00Z" },
            { "tsfrac", "2026-06-01T08:30:00.25Z" },
            { "str", "'Zoë 🚢'" },
            { "quote", "'O''Brien'" },
            { "ctrl", "'a\\nb\\tc\\u{1B}[31m'" },
            { "backslash", "'C:\\\\ferry'" },
            { "textnan", "'nan'" },
        };
        return d;
    }

    private static Value ValueFor(string name) => name switch
    {
        "int" => Value.Of(42L),
        "negint" => Value.Of(-7L),
        "float" => Value.Of(3.0),
        "float2" => Value.Of(0.1),
        "floatexp" => Value.Of(1e20),
        "negzero" => Value.Of(-0.0),
        "nanvalue" => Value.Of(double.NaN),
        "inf" => Value.Of(double.PositiveInfinity),
        "neginf" => Value.Of(double.NegativeInfinity),
        "true" => Value.Of(true),
        "nan" => Value.NaN,
        "none" => Value.NoneRef,
        "null" => Value.Null,
        "nat" => Value.NaT,
        "ts" => Value.Timestamp(ValueText.ToMicros(new DateTimeOffset(2026, 6, 1, 8, 30, 0, TimeSpan.Zero))),
        "tsfrac" => Value.Timestamp(ValueText.ToMicros(new DateTimeOffset(2026, 6, 1, 8, 30, 0, TimeSpan.Zero)) + 250_000),
        "str" => Value.Of("Zoë 🚢"),
        "quote" => Value.Of("O'Brien"),
        "ctrl" => Value.Of("a\nb\tc\u001b[31m"),
        "backslash" => Value.Of("C:\\ferry"),
        "textnan" => Value.Of("nan"),
        _ => throw new ArgumentException(name),
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void Display_and_parse_round_trip(string name, string text)
    {
        var v = ValueFor(name);
        Assert.Equal(text, CellText.Display(v));
        Assert.True(CellText.TryParse(text, out var back, out var error), error);
        Assert.Equal(v, back);
    }

    [Fact]
    public void Float_nan_value_is_not_the_nan_marker()
    {
        // Spec §2.1: under null a NaN from 0/0 is a value, distinct from the missing marker.
        Assert.NotEqual(CellText.Display(Value.NaN), CellText.Display(Value.Of(double.NaN)));
    }

    [Theory]
    [InlineData("\u202Eevil", "\\u{202E}evil")]   // Unicode UAX #9: bidi override must not reorder the terminal line
    [InlineData("a\u0007b", "a\\u{7}b")]
    [InlineData("plain 'text'", "plain 'text'")]
    public void Safe_escapes_control_and_bidi_characters(string input, string expected) =>
        Assert.Equal(expected, CellText.Safe(input));

    [Theory]
    [InlineData("'open")]
    [InlineData("'bad \\q escape'")]
    [InlineData("1.5.2")]
    [InlineData("12abc")]
    [InlineData("2026-13-01T00:00:00Z")]
    [InlineData("")]
    [InlineData("'a' tail")]
    public void Rejects_malformed_cells(string text) => Assert.False(CellText.TryParse(text, out _, out _));
}
