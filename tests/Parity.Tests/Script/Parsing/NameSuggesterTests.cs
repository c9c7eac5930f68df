using Parity.Script.Diagnostics;

namespace Parity.Tests.Script.Parsing;

/// <summary>"Did you mean" (spec §3.5 message form): closest candidate by edit distance, deterministic.</summary>
public sealed class NameSuggesterTests
{
    private static readonly string[] Columns = ["ticket_id", "sailing_id", "passenger", "age", "fare", "paid_at", "note", "is_child"];

    [Theory]
    [InlineData("fair", "fare")] // Spec §3.5 example
    [InlineData("Fare", "fare")]
    [InlineData("FARE", "fare")]
    [InlineData("passanger", "passenger")]
    [InlineData("pasenger", "passenger")]
    [InlineData("ticketid", "ticket_id")]
    [InlineData("aeg", "age")] // an adjacent swap is one edit
    [InlineData("nte", "note")]
    [InlineData("is_chlid", "is_child")]
    [InlineData("xyz", null)]
    [InlineData("fare", null)] // an exact match is no suggestion
    [InlineData("", null)]
    [InlineData("completely_different", null)]
    public void Suggests_the_closest_column(string name, string? expected) =>
        Assert.Equal(expected, NameSuggester.Suggest(name, Columns));

    [Fact]
    public void Ties_prefer_case_sensitive_closeness_then_ordinal_order_whatever_the_input_order()
    {
        Assert.Equal("Fare", NameSuggester.Suggest("Fary", ["fare", "Fare"]));
        Assert.Equal("Fare", NameSuggester.Suggest("Fary", ["Fare", "fare"]));
        // Same distance both ways: the ordinally smaller name wins (common practice, no source).
        Assert.Equal("bat", NameSuggester.Suggest("cat", ["rat", "bat"]));
        Assert.Equal("bat", NameSuggester.Suggest("cat", ["bat", "rat"]));
    }

    [Fact]
    public void Counts_code_points_so_an_emoji_is_one_edit()
    {
        // Unicode scalar values via .NET's Rune: "🚢x" to "🚤x" is one substitution, not two.
        Assert.Equal("🚤 boats", NameSuggester.Suggest("🚢 boats", ["🚤 boats", "coats"]));
        Assert.Equal("εισιτήρια", NameSuggester.Suggest("ΕΙΣΙΤΉΡΙΑ", ["εισιτήρια"]));
    }

    [Fact]
    public void Did_you_mean_formats_the_suffix()
    {
        Assert.Equal(" (did you mean 'fare'?)", NameSuggester.DidYouMean("fair", Columns));
        Assert.Equal("", NameSuggester.DidYouMean("zzzz", Columns));
    }
}
