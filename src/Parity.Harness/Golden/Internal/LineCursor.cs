using System.Globalization;
using Parity.Engine.Errors;
using Parity.Harness.Formatting;

namespace Parity.Harness.Golden.Internal;

/// <summary>
/// Reads a golden text file line by line and token by token; every failure is an E-GOLDEN error at
/// <c>file:line:col</c> (1-based, column in UTF-16 units from the line start).
/// </summary>
internal sealed class LineCursor
{
    private readonly string _file;
    private readonly string[] _lines;
    private int _index = -1;
    private int _pos;

    public LineCursor(string text, string file)
    {
        _file = file;
        var t = text.Replace("\r\n", "\n", StringComparison.Ordinal);
        if (t.EndsWith('\n')) t = t[..^1];
        _lines = t.Length == 0 ? [] : t.Split('\n');
    }

    public string Line { get; private set; } = "";

    public int LineNumber => _index + 1;

    public bool AtEndOfFile => _index + 1 >= _lines.Length;

    public bool AtEndOfLine => _pos >= Line.Length;

    public int Position => _pos;

    public bool Next()
    {
        if (_index + 1 >= _lines.Length)
        {
            _index = _lines.Length;
            Line = "";
            _pos = 0;
            return false;
        }
        _index++;
        Line = _lines[_index];
        _pos = 0;
        return true;
    }

    public void NextOrFail(string expected)
    {
        if (!Next()) throw Fail("unexpected end of file: expected " + expected);
    }

    public string PeekWord()
    {
        var save = _pos;
        var w = Word();
        _pos = save;
        return w;
    }

    public string Word()
    {
        SkipSpaces();
        var start = _pos;
        while (_pos < Line.Length && Line[_pos] != ' ') _pos++;
        if (start == _pos) throw Fail("expected a word");
        return Line[start.._pos];
    }

    public void Expect(string word)
    {
        SkipSpaces();
        var start = _pos;
        var w = _pos < Line.Length ? Word() : "";
        if (!string.Equals(w, word, StringComparison.Ordinal))
        {
            _pos = start;
            throw Fail("expected '" + word + "'" + (w.Length == 0 ? "" : ", found " + CellText.Quote(w)));
        }
    }

    public string Quoted()
    {
        SkipSpaces();
        if (_pos >= Line.Length || Line[_pos] != '\'') throw Fail("expected a quoted string");
        var end = CellText.ScanQuoted(Line, _pos, out var s, out var error);
        if (end < 0) throw Fail(error ?? "bad string");
        _pos = end;
        return s!;
    }

    /// <summary>A quoted string, or <c>-</c> for none.</summary>
    public string? QuotedOrDash()
    {
        SkipSpaces();
        if (_pos < Line.Length && Line[_pos] == '-' && (_pos + 1 == Line.Length || Line[_pos + 1] == ' '))
        {
            _pos++;
            return null;
        }
        return Quoted();
    }

    public long Integer(long min = 0, long max = long.MaxValue)
    {
        SkipSpaces();
        var start = _pos;
        var w = Word();
        if (!long.TryParse(w, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out var v) || v < min || v > max)
        {
            _pos = start;
            throw Fail("expected a whole number" + (min == 0 ? " (0 or more)" : ""));
        }
        return v;
    }

    public void EndOfLine()
    {
        SkipSpaces();
        if (_pos < Line.Length) throw Fail("unexpected text at the end of the line");
    }

    public EngineException Fail(string message) =>
        new(ErrorCodes.Golden, message, _file, Math.Max(1, LineNumber), _pos + 1);

    public EngineException FailAt(int pos, string message) =>
        new(ErrorCodes.Golden, message, _file, Math.Max(1, LineNumber), pos + 1);

    public void SkipSpaces()
    {
        while (_pos < Line.Length && Line[_pos] == ' ') _pos++;
    }

    public void Advance(int to) => _pos = to;
}
