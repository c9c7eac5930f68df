using System.Buffers;
using System.Globalization;
using System.Text;

namespace Parity.Script.Parsing;

/// <summary>
/// Splits script text into tokens (spec §3). Never throws: malformed text becomes a <c>Bad*</c> token that the
/// parser reports. Line breaks are <c>\n</c>, <c>\r\n</c> or <c>\r</c>; a <c>\</c> followed only by spaces or
/// tabs up to the line break joins the next line; <c>#</c> starts a comment that runs to the line break.
/// </summary>
internal sealed class Lexer
{
    private readonly string _text;
    private readonly List<Token> _tokens = [];
    private int _pos;
    private int _line;
    private int _column;

    private Lexer(string text)
    {
        _text = text;
    }

    /// <summary>All tokens of <paramref name="text"/>, ending with exactly one <see cref="TokenKind.EndOfText"/>.</summary>
    public static List<Token> Tokenize(string text)
    {
        var lexer = new Lexer(text);
        lexer.Run();
        return lexer._tokens;
    }

    /// <summary>The value of a string literal or quoted name token: quotes removed, doubled quotes undone.</summary>
    public static string Unquote(string source, Token token)
    {
        var text = token.Text(source);
        if (text.Length < 2) return "";
        var quote = text[0];
        var inner = text[1..^1];
        if (inner.IndexOf(quote) < 0) return inner.ToString();
        var sb = new StringBuilder(inner.Length);
        for (var i = 0; i < inner.Length; i++)
        {
            sb.Append(inner[i]);
            if (inner[i] == quote) i++; // a doubled quote stands for one
        }
        return sb.ToString();
    }

    /// <summary>True for a character that may start a bare word: a letter (any script) or <c>_</c>.</summary>
    public static bool IsWordStart(Rune r) => r.Value == '_' || Rune.IsLetter(r);

    /// <summary>True for a character that may continue a bare word: letters, digits, combining marks, <c>_</c>.</summary>
    public static bool IsWordPart(Rune r)
    {
        if (r.Value == '_' || Rune.IsLetterOrDigit(r)) return true;
        var category = Rune.GetUnicodeCategory(r);
        return category is UnicodeCategory.NonSpacingMark or UnicodeCategory.SpacingCombiningMark
            or UnicodeCategory.ConnectorPunctuation or UnicodeCategory.LetterNumber;
    }

    private void Run()
    {
        // A byte order mark at the start is not part of the script.
        if (_text.Length > 0 && _text[0] == '\uFEFF') _pos = 1;

        while (_pos < _text.Length)
        {
            var c = _text[_pos];
            switch (c)
            {
                case '\n':
                case '\r':
                    Emit(TokenKind.Newline, c == '\r' && Peek(1) == '\n' ? 2 : 1);
                    _line++;
                    _column = 0;
                    continue;
                case '#':
                    SkipComment();
                    continue;
                case '\\':
                    if (!TryContinuation()) EmitAdvance(TokenKind.BadCharacter, 1);
                    continue;
                case '\'':
                    LexQuoted('\'', TokenKind.String, TokenKind.UnterminatedString);
                    continue;
                case '"':
                    LexQuoted('"', TokenKind.QuotedName, TokenKind.UnterminatedName);
                    continue;
                case '=': EmitAdvance(TokenKind.Equal, 1); continue;
                case '+': EmitAdvance(TokenKind.Plus, 1); continue;
                case '-': EmitAdvance(TokenKind.Minus, 1); continue;
                case '*': EmitAdvance(TokenKind.Star, 1); continue;
                case '/': EmitAdvance(TokenKind.Slash, 1); continue;
                case '%': EmitAdvance(TokenKind.Percent, 1); continue;
                case '(': EmitAdvance(TokenKind.LeftParen, 1); continue;
                case ')': EmitAdvance(TokenKind.RightParen, 1); continue;
                case '[': EmitAdvance(TokenKind.LeftBracket, 1); continue;
                case ']': EmitAdvance(TokenKind.RightBracket, 1); continue;
                case ',': EmitAdvance(TokenKind.Comma, 1); continue;
                case '.': EmitAdvance(TokenKind.Dot, 1); continue;
                case '<':
                    if (Peek(1) == '=') EmitAdvance(TokenKind.LessEqual, 2);
                    else if (Peek(1) == '>') EmitAdvance(TokenKind.NotEqual, 2);
                    else EmitAdvance(TokenKind.Less, 1);
                    continue;
                case '>':
                    EmitAdvance(Peek(1) == '=' ? TokenKind.GreaterEqual : TokenKind.Greater, Peek(1) == '=' ? 2 : 1);
                    continue;
                case '!':
                    EmitAdvance(Peek(1) == '=' ? TokenKind.NotEqual : TokenKind.BadCharacter, Peek(1) == '=' ? 2 : 1);
                    continue;
                case '|':
                    EmitAdvance(Peek(1) == '|' ? TokenKind.Concat : TokenKind.BadCharacter, Peek(1) == '|' ? 2 : 1);
                    continue;
            }

            if (c is >= '0' and <= '9')
            {
                LexNumber();
                continue;
            }

            var rune = RuneAt(_pos, out var width);
            if (IsWordStart(rune))
            {
                LexWord();
                continue;
            }
            if (Rune.IsWhiteSpace(rune))
            {
                Advance(width);
                continue;
            }
            EmitAdvance(TokenKind.BadCharacter, width);
        }
        _tokens.Add(new Token(TokenKind.EndOfText, _text.Length, 0, _line, _column));
    }

    private char Peek(int ahead) => _pos + ahead < _text.Length ? _text[_pos + ahead] : '\0';

    /// <summary>The code point at <paramref name="index"/>; a lone surrogate counts as one (replacement) character.</summary>
    private Rune RuneAt(int index, out int width)
    {
        if (Rune.DecodeFromUtf16(_text.AsSpan(index), out var rune, out width) == OperationStatus.Done) return rune;
        width = 1;
        return Rune.ReplacementChar;
    }

    private void Emit(TokenKind kind, int length)
    {
        _tokens.Add(new Token(kind, _pos, length, _line, _column));
        _pos += length;
    }

    private void EmitAdvance(TokenKind kind, int length)
    {
        _tokens.Add(new Token(kind, _pos, length, _line, _column));
        Advance(length);
    }

    /// <summary>Moves over <paramref name="length"/> UTF-16 units of one line, counting code points for the column.</summary>
    private void Advance(int length)
    {
        var end = _pos + length;
        while (_pos < end)
        {
            if (char.IsHighSurrogate(_text[_pos]) && _pos + 1 < _text.Length && char.IsLowSurrogate(_text[_pos + 1]))
                _pos += 2;
            else
                _pos++;
            _column++;
        }
    }

    private void SkipComment()
    {
        var end = _pos;
        while (end < _text.Length && _text[end] != '\n' && _text[end] != '\r') end++;
        Advance(end - _pos);
    }

    /// <summary>A <c>\</c> followed by spaces or tabs and a line break (or the end): both vanish.</summary>
    private bool TryContinuation()
    {
        var j = _pos + 1;
        while (j < _text.Length && (_text[j] == ' ' || _text[j] == '\t')) j++;
        if (j < _text.Length && _text[j] != '\n' && _text[j] != '\r') return false;
        if (j < _text.Length) j += _text[j] == '\r' && j + 1 < _text.Length && _text[j + 1] == '\n' ? 2 : 1;
        _pos = j;
        _line++;
        _column = 0;
        return true;
    }

    /// <summary>A quoted string or name; a doubled quote is an escaped quote; it may not cross a line break.</summary>
    private void LexQuoted(char quote, TokenKind kind, TokenKind unterminated)
    {
        var j = _pos + 1;
        while (j < _text.Length)
        {
            var c = _text[j];
            if (c == '\n' || c == '\r') break;
            if (c == quote)
            {
                if (j + 1 < _text.Length && _text[j + 1] == quote)
                {
                    j += 2;
                    continue;
                }
                var length = j + 1 - _pos;
                EmitAdvance(kind == TokenKind.QuotedName && length == 2 ? TokenKind.EmptyName : kind, length);
                return;
            }
            j++;
        }
        EmitAdvance(unterminated, j - _pos);
    }

    /// <summary><c>digits [. digits] [e [+|-] digits]</c>; letters, digits or a dot and digit glued to the end make it malformed.</summary>
    private void LexNumber()
    {
        var j = _pos;
        var kind = TokenKind.Integer;
        while (j < _text.Length && char.IsAsciiDigit(_text[j])) j++;
        if (j + 1 < _text.Length && _text[j] == '.' && char.IsAsciiDigit(_text[j + 1]))
        {
            kind = TokenKind.Float;
            j++;
            while (j < _text.Length && char.IsAsciiDigit(_text[j])) j++;
        }
        if (j < _text.Length && (_text[j] == 'e' || _text[j] == 'E'))
        {
            var k = j + 1;
            if (k < _text.Length && (_text[k] == '+' || _text[k] == '-')) k++;
            if (k < _text.Length && char.IsAsciiDigit(_text[k]))
            {
                kind = TokenKind.Float;
                j = k;
                while (j < _text.Length && char.IsAsciiDigit(_text[j])) j++;
            }
        }
        // "12abc" or "1.2.3" is one malformed token, not a number followed by a name.
        var glued = false;
        while (j < _text.Length)
        {
            var c = _text[j];
            // A dot glues only before a digit: "1.2.3" is malformed, "(tickets take 2).fare" is not.
            if (char.IsAsciiDigit(c) || (c == '.' && j + 1 < _text.Length && char.IsAsciiDigit(_text[j + 1])))
            {
                j++;
                glued = true;
                continue;
            }
            var rune = RuneAt(j, out var width);
            if (!IsWordPart(rune)) break;
            j += width;
            glued = true;
        }
        EmitAdvance(glued ? TokenKind.BadNumber : kind, j - _pos);
    }

    private void LexWord()
    {
        var j = _pos;
        while (j < _text.Length)
        {
            var rune = RuneAt(j, out var width);
            if (!IsWordPart(rune)) break;
            j += width;
        }
        EmitAdvance(TokenKind.Word, j - _pos);
    }
}
