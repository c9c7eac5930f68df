using System.Globalization;
using Parity.Engine.Values;

namespace Parity.Tests.Engine;

public sealed class ValueTextTests
{
    // Spec §2.3: text of a float is its shortest round-trip form with at least one fractional digit.
    // Shortest round-trip digits: IEEE 754 binary64 and .NET's "R" formatting (values from memory).
    [Theory]
    [InlineData(3.0, "3.0")]
    [InlineData(0.1, "0.1")]
    [InlineData(-2.5, "-2.5")]
    [InlineData(1e20, "1.0E+20")]
    [InlineData(1.5e-7, "1.5E-07")]
    [InlineData(0.30000000000000004, "0.30000000000000004")]
    [InlineData(double.PositiveInfinity, "Infinity")]
    [InlineData(double.NegativeInfinity, "-Infinity")]
    [InlineData(double.NaN, "NaN")]
    public void Floats_use_shortest_round_trip_with_a_fraction(double value, string expected)
    {
        Assert.Equal(expected, ValueText.FormatFloat(value));
        if (double.IsFinite(value))
            Assert.Equal(value, double.Parse(expected, CultureInfo.InvariantCulture)); // round trip
    }

    [Fact]
    public void Float_text_ignores_the_current_culture()
    {
        var saved = CultureInfo.CurrentCulture;
        try
        {
            foreach (var name in new[] { "de-DE", "tr-TR", "ar-SA", "en-US" })
            {
                CultureInfo.CurrentCulture = CultureInfo.GetCultureInfo(name);
                Assert.Equal("1234.5", ValueText.FormatFloat(1234.5));
                Assert.Equal("-7", ValueText.Format(Value.Of(-7L)));
            }
        }
        finally
        {
            CultureInfo.CurrentCulture = saved;
        }
    }

    // Spec §2.3 and ISO 8601: UTC instants print with a Z; fractional seconds only when present.
    [Theory]
    [InlineData(0L, "1970-01-01T00:00:00Z")]
    [InlineData(1_700_000_000_123_456L, "2023-11-14T22:13:20.123456Z")]
    [InlineData(1_700_000_000_500_000L, "2023-11-14T22:13:20.5Z")]
    [InlineData(-1L, "1969-12-31T23:59:59.999999Z")]
    public void Timestamps_print_as_iso_8601_utc(long micros, string expected) =>
        Assert.Equal(expected, ValueText.FormatTimestamp(micros));

    [Fact]
    public void Missing_markers_have_distinct_names()
    {
        // Spec §5: golden text tells NaN, None and null apart (and NaT for timestamps).
        Assert.Equal("NaN", ValueText.MissingName(MissingKind.NaN));
        Assert.Equal("None", ValueText.MissingName(MissingKind.NoneRef));
        Assert.Equal("null", ValueText.MissingName(MissingKind.Null));
        Assert.Equal("NaT", ValueText.MissingName(MissingKind.NaT));
    }
}
