using System.Globalization;
using Parity.Engine.Errors;
using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Parsing;

/// <summary>
/// Recursive-descent parser for spec §3. One statement per logical line; on the first error in a statement
/// it records one diagnostic and resumes at the next line, so every broken statement is reported.
/// Node spans start at the token that best locates an error: a statement or clause keyword, a name, a
/// literal, an operator (binary, unary and <c>is</c> nodes point at their operator) or a function name.
/// </summary>
internal sealed partial class Parser
{
    /// <summary>Deepest nesting of parentheses, unary operators and expression trees accepted (E-LIMIT beyond).</summary>
    public const int MaxDepth = 200;

    private readonly string _text;
    private readonly string _file;
    private readonly List<Token> _tokens;
    private readonly List<Diagnostic> _diagnostics;
    private readonly Dictionary<Expr, int> _depths = new(ReferenceEqualityComparer.Instance);
    private readonly HashSet<string> _brokenDefinitions = new(StringComparer.Ordinal);
    private int _index;
    private int _nesting;
    private string? _definingName;

    private Parser(string text, string file, List<Diagnostic> diagnostics)
    {
        _text = text;
        _file = file;
        _tokens = Lexer.Tokenize(text);
        _diagnostics = diagnostics;
    }

    /// <summary>
    /// Parses <paramref name="text"/>; syntax errors are appended to <paramref name="diagnostics"/>.
    /// <paramref name="brokenDefinitions"/> gets the frame names of <c>load</c> and <c>let</c> statements that
    /// failed after their name, so the checker does not report every later use of them as unknown.
    /// </summary>
    public static ScriptNode Parse(string text, string file, List<Diagnostic> diagnostics, out IReadOnlySet<string> brokenDefinitions)
    {
        var parser = new Parser(text, file, diagnostics);
        var script = parser.ParseScript();
        brokenDefinitions = parser._brokenDefinitions;
        return script;
    }

    private Token Current => _tokens[_index];

    private Token Previous => _tokens[_index > 0 ? _index - 1 : 0];

    private Token PeekToken(int ahead) => _tokens[Math.Min(_index + ahead, _tokens.Count - 1)];

    private ScriptNode ParseScript()
    {
        var statements = new List<Statement>();
        while (Current.Kind != TokenKind.EndOfText)
        {
            if (Current.Kind == TokenKind.Newline)
            {
                _index++;
                continue;
            }
            _definingName = null;
            var first = _index;
            try
            {
                var statement = ParseStatement();
                if (!AtLineEnd) throw Expected("end of line");
                statements.Add(statement with { Canonical = CanonicalText(first, _index), LastLine = Previous.Line });
            }
            catch (SyntaxFailure failure)
            {
                _diagnostics.Add(failure.Diagnostic);
                if (_definingName is not null) _brokenDefinitions.Add(_definingName);
                while (!AtLineEnd) _index++;
            }
            _nesting = 0;
            _depths.Clear();
        }
        return new ScriptNode(_file, statements);
    }

    private bool AtLineEnd => Current.Kind is TokenKind.Newline or TokenKind.EndOfText;

    /// <summary>Tokens <paramref name="from"/> up to <paramref name="to"/> (exclusive) joined by one space, keywords lower-cased.</summary>
    private string CanonicalText(int from, int to)
    {
        // One space between tokens, except around '.', inside brackets, before ',' and between a function
        // name and its '(' — the way the language reference writes statements (docs/language.md).
        var sb = new System.Text.StringBuilder();
        for (var i = from; i < to; i++)
        {
            var token = _tokens[i];
            if (i > from)
            {
                var previous = _tokens[i - 1];
                var tight = token.Kind is TokenKind.Comma or TokenKind.RightParen or TokenKind.RightBracket or TokenKind.Dot
                    || previous.Kind is TokenKind.LeftParen or TokenKind.LeftBracket or TokenKind.Dot
                    || (token.Kind == TokenKind.LeftParen && previous.Kind == TokenKind.Word && !Keywords.IsReserved(previous.Text(_text)));
                if (!tight) sb.Append(' ');
            }
            var text = token.Text(_text);
            if (token.Kind == TokenKind.Word && Keywords.IsReserved(text)) sb.Append(text.ToString().ToLowerInvariant());
            else sb.Append(text);
        }
        return sb.ToString();
    }

    private Statement ParseStatement()
    {
        var start = Current;
        if (IsKeyword(start, "load")) return ParseLoad();
        if (IsKeyword(start, "let")) return ParseLet();
        if (IsKeyword(start, "set")) return ParseSet();
        if (IsKeyword(start, "check")) return ParseCheck();
        throw Expected("a statement (load, let, set or check)", Keywords.StatementWords);
    }

    private LoadStatement ParseLoad()
    {
        var start = Advance();
        var name = ParseName("a frame name");
        _definingName = name.Name;
        ExpectKeyword("from");
        if (Current.Kind != TokenKind.String) throw Expected("a path in single quotes");
        var pathToken = Advance();
        Identifier? format = null;
        if (IsKeyword(Current, "as"))
        {
            Advance();
            if (Current.Kind != TokenKind.Word || Keywords.IsReserved(Current.Text(_text)))
                throw Expected("a file format (csv, parquet or arrow)");
            var token = Advance();
            format = new Identifier(token.Text(_text).ToString(), token.Span);
        }
        var options = new List<LoadOption>();
        if (IsKeyword(Current, "with"))
        {
            Advance();
            Expect(TokenKind.LeftParen, "'(' after 'with'");
            do
            {
                options.Add(ParseLoadOption());
            }
            while (Accept(TokenKind.Comma));
            Expect(TokenKind.RightParen, "',' or ')'");
        }
        return new LoadStatement(name, Lexer.Unquote(_text, pathToken), pathToken.Span, format, options, SpanFrom(start));
    }

    private LoadOption ParseLoadOption()
    {
        // Option keys are matched by position, so a reserved word such as 'missing' is a key here.
        if (Current.Kind is not (TokenKind.Word or TokenKind.QuotedName)) throw Expected("an option name");
        var keyToken = Advance();
        var key = new Identifier(
            keyToken.Kind == TokenKind.QuotedName ? Lexer.Unquote(_text, keyToken) : keyToken.Text(_text).ToString(),
            keyToken.Span);
        Expect(TokenKind.Equal, "'=' after the option name");
        var values = new List<LiteralExpr>();
        var isList = Accept(TokenKind.LeftBracket);
        if (isList)
        {
            if (Current.Kind != TokenKind.RightBracket)
            {
                do
                {
                    values.Add(ParseLiteral("a literal value"));
                }
                while (Accept(TokenKind.Comma));
            }
            Expect(TokenKind.RightBracket, "',' or ']'");
        }
        else
        {
            values.Add(ParseLiteral("a literal value or a [list]"));
        }
        return new LoadOption(key, values, isList, SpanFrom(keyToken));
    }

    private LetStatement ParseLet()
    {
        var start = Advance();
        var name = ParseName("a frame name");
        _definingName = name.Name;
        Expect(TokenKind.Equal, "'=' after the frame name");
        var value = ParseDerivation(inParentheses: false);
        return new LetStatement(name, value, SpanFrom(start));
    }

    private SetStatement ParseSet()
    {
        var start = Advance();
        Identifier? frame = null;
        Derivation? chain = null;
        if (Accept(TokenKind.LeftParen))
        {
            chain = ParseDerivation(inParentheses: true);
            Expect(TokenKind.RightParen, "')'");
        }
        else
        {
            frame = ParseName("a frame name or '(' and a derivation");
        }
        Expect(TokenKind.Dot, "'.' and a column name");
        var column = ParseName("a column name");
        Expect(TokenKind.Equal, "'=' after the column name");
        var value = ParseExpression();
        Expr? condition = null;
        if (IsKeyword(Current, "where"))
        {
            Advance();
            condition = ParseExpression();
        }
        else if (!AtLineEnd)
        {
            throw Expected("an operator, 'where' or end of line", ["where"]);
        }
        return new SetStatement(frame, chain, column, value, condition, SpanFrom(start));
    }

    private CheckStatement ParseCheck()
    {
        var start = Advance();
        var frame = ParseName("a frame name");
        List<Identifier> keys = [];
        // 'key' is not reserved: it is recognised here by position only.
        if (IsKeyword(Current, "key"))
        {
            Advance();
            keys = ParseNameList();
        }
        string? label = null;
        if (IsKeyword(Current, "as"))
        {
            Advance();
            if (Current.Kind != TokenKind.String) throw Expected("a label in single quotes");
            label = Lexer.Unquote(_text, Advance());
        }
        else if (!AtLineEnd)
        {
            throw Expected(keys.Count == 0 ? "'key', 'as' or end of line" : "',', 'as' or end of line", keys.Count == 0 ? ["key", "as"] : ["as"]);
        }
        return new CheckStatement(frame, label, SpanFrom(start)) { Keys = keys };
    }

    // ---- token helpers ----

    private Token Advance()
    {
        var token = _tokens[_index];
        if (token.Kind != TokenKind.EndOfText) _index++;
        return token;
    }

    private bool Accept(TokenKind kind)
    {
        if (Current.Kind != kind) return false;
        _index++;
        return true;
    }

    private Token Expect(TokenKind kind, string expected)
    {
        if (Current.Kind != kind) throw Expected(expected);
        return Advance();
    }

    private bool IsKeyword(Token token, string keyword) =>
        token.Kind == TokenKind.Word && token.Text(_text).Equals(keyword, StringComparison.OrdinalIgnoreCase);

    private Token ExpectKeyword(string keyword)
    {
        if (!IsKeyword(Current, keyword)) throw Expected("'" + keyword + "'", [keyword]);
        return Advance();
    }

    private bool IsName(Token token) =>
        token.Kind == TokenKind.QuotedName || (token.Kind == TokenKind.Word && !Keywords.IsReserved(token.Text(_text)));

    /// <summary>A bare word that is not reserved, or a double-quoted name.</summary>
    private Identifier ParseName(string expected)
    {
        var token = Current;
        if (token.Kind == TokenKind.QuotedName)
        {
            Advance();
            return new Identifier(Lexer.Unquote(_text, token), token.Span);
        }
        if (token.Kind == TokenKind.Word)
        {
            var word = token.Text(_text).ToString();
            if (Keywords.IsReserved(word))
            {
                throw Failure(token, "expected " + expected + ", found keyword '" + word + "' (write \"" + word
                    + "\" to use it as a name)");
            }
            Advance();
            return new Identifier(word, token.Span);
        }
        throw Expected(expected);
    }

    /// <summary>A span from <paramref name="start"/> to the end of the last token consumed.</summary>
    private SourceSpan SpanFrom(Token start)
    {
        var end = Math.Max(Previous.End, start.End);
        return new SourceSpan(start.Offset, end - start.Offset, start.Line, start.Column);
    }

    private static SourceSpan SpanFrom(SourceSpan start, SourceSpan end) =>
        new(start.Offset, Math.Max(end.Offset + end.Length, start.Offset + start.Length) - start.Offset, start.Line, start.Column);

    // ---- errors ----

    /// <summary>"expected X, found Y" at the current token; a malformed token reports itself instead.</summary>
    private SyntaxFailure Expected(string expected, IEnumerable<string>? suggestions = null)
    {
        var token = Current;
        var bad = DescribeBadToken(token);
        if (bad is not null) return Failure(token, bad);
        var message = "expected " + expected + ", found " + Describe(token);
        if (suggestions is not null && token.Kind == TokenKind.Word)
        {
            var suggestion = NameSuggester.Suggest(token.Text(_text).ToString(), suggestions);
            if (suggestion is not null) message += " (did you mean '" + suggestion + "'?)";
        }
        return Failure(token, message);
    }

    private SyntaxFailure Failure(Token token, string message, string code = ErrorCodes.Syntax) =>
        new(new Diagnostic(code, message, _file, token.Span));

    private string? DescribeBadToken(Token token) => token.Kind switch
    {
        TokenKind.BadCharacter => "unexpected character " + DescribeCharacter(token.Text(_text))
            + (token.Text(_text)[0] > 127 && !char.IsWhiteSpace(token.Text(_text)[0])
                ? " (a name with symbols is written in double quotes, such as \"" + token.Text(_text).ToString() + "\")"
                : ""),
        TokenKind.UnterminatedString => "unterminated string: a string literal must end with ' on the same line (write '' for a quote inside)",
        TokenKind.UnterminatedName => "unterminated quoted name: a name in double quotes must end with \" on the same line (write \"\" for a quote inside)",
        TokenKind.EmptyName => "empty quoted name \"\"",
        TokenKind.BadNumber => "malformed number '" + Clip(token.Text(_text)) + "'",
        _ => null,
    };

    private string Describe(Token token) => token.Kind switch
    {
        TokenKind.Newline => "end of line",
        TokenKind.EndOfText => "end of script",
        TokenKind.String => "string " + Clip(token.Text(_text)),
        TokenKind.QuotedName => "name " + Clip(token.Text(_text)),
        TokenKind.Integer or TokenKind.Float => "number " + Clip(token.Text(_text)),
        TokenKind.Word when Keywords.IsReserved(token.Text(_text)) => "keyword '" + token.Text(_text).ToString() + "'",
        TokenKind.Word => "name '" + Clip(token.Text(_text)) + "'",
        _ => "'" + token.Text(_text).ToString() + "'",
    };

    private static string DescribeCharacter(ReadOnlySpan<char> text)
    {
        if (text.Length == 1 && (char.IsControl(text[0]) || char.IsSurrogate(text[0]) || char.IsWhiteSpace(text[0])))
            return "U+" + ((int)text[0]).ToString("X4", CultureInfo.InvariantCulture);
        return "'" + text.ToString() + "'";
    }

    /// <summary>Token text shortened for a message (40 code points at most).</summary>
    private static string Clip(ReadOnlySpan<char> text)
    {
        const int Max = 40;
        var count = 0;
        for (var i = 0; i < text.Length; i++)
        {
            if (char.IsHighSurrogate(text[i]) && i + 1 < text.Length && char.IsLowSurrogate(text[i + 1])) i++;
            if (++count == Max && i + 1 < text.Length) return text[..(i + 1)].ToString() + "...";
        }
        return text.ToString();
    }

    /// <summary>Unwinds one statement; caught in <see cref="ParseScript"/>, never escapes the parser.</summary>
    private sealed class SyntaxFailure(Diagnostic diagnostic) : Exception(diagnostic.Message)
    {
        public Diagnostic Diagnostic { get; } = diagnostic;
    }
}
