using System.Text;
using Parity.Script.Parsing;
using Parity.Script.Syntax;

namespace Parity.Tests.Script.Parsing;

/// <summary>
/// Robustness (spec §3.5: every error names file, line and column): random token soup and mutated valid
/// scripts never make the parser throw, and every diagnostic points inside the text. Fixed seeds, so a
/// failure reproduces.
/// </summary>
public sealed class ParserFuzzTests
{
    private static readonly string[] Pieces =
    [
        "load", "let", "set", "check", "from", "as", "with", "where", "take", "skip", "column", "select", "rename", "to",
        "cast", "add", "fill", "drop", "missing", "order", "by", "asc", "desc", "group", "compute", "join", "on", "inner",
        "left", "append", "distinct", "and", "or", "not", "is", "null", "true", "false", "int64", "csv",
        "tickets", "fare", "age", "passenger", "乗客", "ζωή", "\"🚢 boats\"", "\"\"", "\"open", "'text'", "'it''s'", "'open", "'😀'",
        "42", "3.5", "1e999", "99999999999999999999", "12abc", "-", "+", "*", "/", "%", "||", "|", "!", "=", "<>", "!=", "<",
        "<=", ">", ">=", "(", ")", "[", "]", ",", ".", "\\", "\\\n", "#", "\n", "\r\n", "\r", " ", "\t", "count(", "sum(",
        "lenght(", "round(", "\uD800", "\uFEFF", "🚢", "@", "$",
    ];

    [Fact]
    public void Random_token_soup_never_throws()
    {
        var random = new Random(20240601);
        for (var n = 0; n < 2000; n++)
        {
            var sb = new StringBuilder();
            var count = random.Next(1, 40);
            for (var i = 0; i < count; i++)
            {
                sb.Append(Pieces[random.Next(Pieces.Length)]);
                if (random.Next(3) > 0) sb.Append(' ');
            }
            AssertWellFormed(sb.ToString());
        }
    }

    [Fact]
    public void Mutated_valid_scripts_never_throw()
    {
        var sources = new List<string>();
        foreach (var path in Directory.GetFiles(ParserGoldenTests.CasesDirectory(), "ok_*.parity"))
            sources.Add(File.ReadAllText(path, Encoding.UTF8));
        Assert.NotEmpty(sources);

        var random = new Random(7);
        for (var n = 0; n < 2000; n++)
        {
            var text = new StringBuilder(sources[random.Next(sources.Count)]);
            var edits = random.Next(1, 6);
            for (var e = 0; e < edits && text.Length > 0; e++)
            {
                var at = random.Next(text.Length);
                switch (random.Next(4))
                {
                    case 0:
                        text.Remove(at, Math.Min(random.Next(1, 8), text.Length - at));
                        break;
                    case 1:
                        text.Insert(at, Pieces[random.Next(Pieces.Length)]);
                        break;
                    case 2:
                        // Mostly ASCII; sometimes any UTF-16 unit, lone surrogates included.
                        text[at] = random.Next(4) == 0 ? (char)random.Next(0, 0x10000) : (char)random.Next(32, 127);
                        break;
                    default:
                        var from = random.Next(text.Length);
                        var len = Math.Min(random.Next(1, 20), text.Length - from);
                        text.Insert(at, text.ToString(from, len));
                        break;
                }
            }
            AssertWellFormed(text.ToString());
        }
    }

    [Fact]
    public void Valid_scripts_reprint_to_the_same_tree()
    {
        // Printing is a pure function of the tree: parsing twice gives identical text.
        foreach (var path in Directory.GetFiles(ParserGoldenTests.CasesDirectory(), "ok_*.parity"))
        {
            var text = File.ReadAllText(path, Encoding.UTF8);
            var first = ScriptParser.Parse(text, "a.parity");
            Assert.False(first.HasErrors, path + ": " + string.Join("\n", first.Diagnostics));
            Assert.Equal(SyntaxPrinter.Print(first.Script), SyntaxPrinter.Print(ScriptParser.Parse(text, "a.parity").Script));
        }
    }

    /// <summary>
    /// The 0-based line and code point column of a UTF-16 offset, computed independently of the lexer:
    /// \n, \r\n and \r end a line; a leading byte order mark takes no column; a surrogate pair is one column
    /// (one Unicode scalar value) and a lone surrogate counts as one.
    /// </summary>
    private static (int Line, int Column) PositionOf(string text, int offset)
    {
        int line = 0, column = 0;
        var i = text.Length > 0 && text[0] == '\uFEFF' ? 1 : 0;
        while (i < offset)
        {
            var c = text[i];
            if (c == '\r' || c == '\n')
            {
                i += c == '\r' && i + 1 < text.Length && text[i + 1] == '\n' ? 2 : 1;
                line++;
                column = 0;
                continue;
            }
            i += char.IsHighSurrogate(c) && i + 1 < text.Length && char.IsLowSurrogate(text[i + 1]) ? 2 : 1;
            column++;
        }
        return (line, column);
    }

    private static void AssertWellFormed(string text)
    {
        var result = ScriptParser.Parse(text, "fuzz.parity");
        var lines = 1;
        foreach (var c in text) if (c == '\n') lines++;
        foreach (var d in result.Diagnostics)
        {
            Assert.Equal("fuzz.parity", d.File);
            Assert.InRange(d.Span.Offset, 0, text.Length);
            Assert.InRange(d.Span.Offset + d.Span.Length, 0, text.Length);
            Assert.InRange(d.Span.LineNumber, 1, lines + text.Length); // \r alone also ends a line
            Assert.True(d.Span.ColumnNumber >= 1);
            Assert.StartsWith("fuzz.parity:", d.Format(), StringComparison.Ordinal);
            Assert.Equal(PositionOf(text, d.Span.Offset), (d.Span.Line, d.Span.Column));
        }
        _ = SyntaxPrinter.Print(result.Script);
    }
}
