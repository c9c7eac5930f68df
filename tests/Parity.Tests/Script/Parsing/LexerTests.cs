using System.Globalization;
using System.Text;
using Parity.Script.Parsing;

namespace Parity.Tests.Script.Parsing;

/// <summary>Table-driven lexer tests (spec §3): token kinds, text and 0-based line and code point columns.</summary>
public sealed class LexerTests
{
    /// <summary>Each token as <c>Kind:text@line:col</c> (0-based), the final EndOfText left out.</summary>
    private static string Lex(string text)
    {
        var parts = new List<string>();
        foreach (var t in Lexer.Tokenize(text))
        {
            if (t.Kind == TokenKind.EndOfText) break;
            var shown = t.Kind == TokenKind.Newline ? "" : t.Text(text).ToString();
            parts.Add(t.Kind + ":" + shown + "@" + t.Line.ToString(CultureInfo.InvariantCulture) + ":" + t.Column.ToString(CultureInfo.InvariantCulture));
        }
        return string.Join(" ", parts);
    }

    [Theory]
    [InlineData("", "")]
    [InlineData("   \t ", "")]
    [InlineData("# only a comment", "")]
    [InlineData("fare", "Word:fare@0:0")]
    [InlineData("_x1 y_2", "Word:_x1@0:0 Word:y_2@0:4")]
    [InlineData("WHERE where", "Word:WHERE@0:0 Word:where@0:6")]
    [InlineData("42 3.5 1e3 2.5E-3 0", "Integer:42@0:0 Float:3.5@0:3 Float:1e3@0:7 Float:2.5E-3@0:11 Integer:0@0:18")]
    [InlineData("12abc", "BadNumber:12abc@0:0")]
    [InlineData("1.2.3", "BadNumber:1.2.3@0:0")]
    [InlineData("t.fare", "Word:t@0:0 Dot:.@0:1 Word:fare@0:2")]
    [InlineData("2).x 2.x", "Integer:2@0:0 RightParen:)@0:1 Dot:.@0:2 Word:x@0:3 Integer:2@0:5 Dot:.@0:6 Word:x@0:7")]
    [InlineData("'it''s'", "String:'it''s'@0:0")]
    [InlineData("''", "String:''@0:0")]
    [InlineData("'open", "UnterminatedString:'open@0:0")]
    [InlineData("'a\nb'", "UnterminatedString:'a@0:0 Newline:@0:2 Word:b@1:0 UnterminatedString:'@1:1")]
    [InlineData("\"fare usd\"", "QuotedName:\"fare usd\"@0:0")]
    [InlineData("\"say \"\"hi\"\"\"", "QuotedName:\"say \"\"hi\"\"\"@0:0")]
    [InlineData("\"\"", "EmptyName:\"\"@0:0")]
    [InlineData("\"open", "UnterminatedName:\"open@0:0")]
    [InlineData("= <> != < <= > >=", "Equal:=@0:0 NotEqual:<>@0:2 NotEqual:!=@0:5 Less:<@0:8 LessEqual:<=@0:10 Greater:>@0:13 GreaterEqual:>=@0:15")]
    [InlineData("+-*/%||", "Plus:+@0:0 Minus:-@0:1 Star:*@0:2 Slash:/@0:3 Percent:%@0:4 Concat:||@0:5")]
    [InlineData("( ) [ ] ,", "LeftParen:(@0:0 RightParen:)@0:2 LeftBracket:[@0:4 RightBracket:]@0:6 Comma:,@0:8")]
    [InlineData("| ! $ @", "BadCharacter:|@0:0 BadCharacter:!@0:2 BadCharacter:$@0:4 BadCharacter:@@0:6")]
    [InlineData("a # c\nb", "Word:a@0:0 Newline:@0:5 Word:b@1:0")]
    [InlineData("a\r\nb\rc", "Word:a@0:0 Newline:@0:1 Word:b@1:0 Newline:@1:1 Word:c@2:0")]
    [InlineData("a \\\nb", "Word:a@0:0 Word:b@1:0")]
    [InlineData("a \\  \t\r\nb", "Word:a@0:0 Word:b@1:0")]
    [InlineData("a \\", "Word:a@0:0")]
    [InlineData("a \\ b", "Word:a@0:0 BadCharacter:\\@0:2 Word:b@0:4")]
    [InlineData("# c \\\nb", "Newline:@0:5 Word:b@1:0")]
    [InlineData("\uFEFFload", "Word:load@0:0")]
    public void Tokens(string text, string expected) => Assert.Equal(expected, Lex(text));

    // Unicode: Greek, CJK, combining marks are word characters (UAX #31 letters and marks); emoji are not.
    // Columns count code points (Unicode scalar values via .NET's Rune), so an emoji is one column.
    [Theory]
    [InlineData("ζωή x", "Word:ζωή@0:0 Word:x@0:4")]
    [InlineData("乗客 x", "Word:乗客@0:0 Word:x@0:3")]
    [InlineData("cafe\u0301 x", "Word:cafe\u0301@0:0 Word:x@0:6")]
    [InlineData("'😀😀' x", "String:'😀😀'@0:0 Word:x@0:5")]
    [InlineData("\"🚢 boats\" x", "QuotedName:\"🚢 boats\"@0:0 Word:x@0:10")]
    [InlineData("🚢 x", "BadCharacter:🚢@0:0 Word:x@0:2")]
    [InlineData("a\u00A0b", "Word:a@0:0 Word:b@0:2")]
    public void Unicode_tokens_and_code_point_columns(string text, string expected) => Assert.Equal(expected, Lex(text));

    [Fact]
    public void A_lone_surrogate_is_one_bad_character()
    {
        // .NET's Rune.DecodeFromUtf16 rejects an unpaired surrogate; we count it as one column.
        Assert.Equal("BadCharacter:\uD800@0:0 Word:x@0:2", Lex("\uD800 x"));
        Assert.Equal("Word:a@0:0 BadCharacter:\uDC00@0:1", Lex("a\uDC00"));
    }

    [Theory]
    [InlineData("'it''s'", "it's")]
    [InlineData("''''", "'")]
    [InlineData("''", "")]
    [InlineData("\"say \"\"hi\"\"\"", "say \"hi\"")]
    [InlineData("'Ζωή 😀'", "Ζωή 😀")]
    public void Unquote_undoes_doubled_quotes(string text, string expected)
    {
        var token = Lexer.Tokenize(text)[0];
        Assert.Equal(expected, Lexer.Unquote(text, token));
    }

    [Fact]
    public void Offsets_and_lengths_cover_the_token_text_in_utf16_units()
    {
        const string text = "let \"🚢\" = 'ü' || x";
        var tokens = Lexer.Tokenize(text);
        var sb = new StringBuilder();
        foreach (var t in tokens) sb.Append(t.Offset.ToString(CultureInfo.InvariantCulture)).Append('+').Append(t.Length.ToString(CultureInfo.InvariantCulture)).Append(' ');
        // The emoji is a surrogate pair: the quoted name is 4 UTF-16 units long but 3 columns wide.
        Assert.Equal("0+3 4+4 9+1 11+3 15+2 18+1 19+0 ", sb.ToString());
        Assert.Equal(8, tokens[2].Column);
    }

    [Fact]
    public void Ends_with_exactly_one_end_token()
    {
        var tokens = Lexer.Tokenize("a\n");
        Assert.Equal(TokenKind.EndOfText, tokens[^1].Kind);
        Assert.Single(tokens, t => t.Kind == TokenKind.EndOfText);
        Assert.Equal(1, tokens[^1].Line);
    }
}
