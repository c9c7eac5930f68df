using System.Globalization;
using System.Text;
using Parity.Engine.Values;

namespace Parity.Harness.Formatting;

/// <summary>
/// The one text form of a cell for samples, tables and golden files. Every kind prints differently, so
/// the text parses back to the same <see cref="Value"/> (<see cref="TryParse"/>):
/// <list type="bullet">
/// <item>strings in single quotes, <c>'</c> doubled, <c>\</c> doubled, control and invisible format
/// characters escaped (<c>\n</c>, <c>\r</c>, <c>\t</c>, otherwise <c>\u{1B}</c>), so a data value can
/// never drive a terminal or break a line;</item>
/// <item>missing markers bare: <c>NaN</c>, <c>None</c>, <c>null</c>, <c>NaT</c>;</item>
/// <item>integers in invariant digits; floats in shortest round-trip form with at least one fractional
/// digit (<c>3.0</c>, <c>1.0E+20</c>); a non-finite float that is a value, not a marker, as
/// <c>float:NaN</c>, <c>float:Infinity</c>, <c>float:-Infinity</c>;</item>
/// <item>bools <c>true</c>/<c>false</c>; timestamps ISO 8601 UTC with <c>Z</c> (spec §2.3).</item>
/// </list>
/// </summary>
public static class CellText
{
    /// <summary>Prefix of a non-finite float value, so it is not confused with the NaN missing marker.</summary>
    public const string FloatPrefix = "float:";

    public static string Display(Value v) => v.Kind switch
    {
        ValueKind.Missing => ValueText.MissingName(v.Missing),
        ValueKind.String => Quote(v.String),
        ValueKind.Float64 => double.IsFinite(v.Float64) ? ValueText.FormatFloat(v.Float64) : FloatPrefix + ValueText.FormatFloat(v.Float64),
        _ => ValueText.Format(v),
    };

    /// <summary>A string in single quotes with <see cref="AppendEscaped"/> escaping; also used for names in golden headers.</summary>
    public static string Quote(string s)
    {
        var sb = new StringBuilder(s.Length + 2);
        sb.Append('\'');
        AppendEscaped(sb, s, quote: true);
        sb.Append('\'');
        return sb.ToString();
    }

    /// <summary>
    /// Text that is safe on a terminal and on one line: control and invisible format characters escaped as in
    /// <see cref="Quote"/>, nothing else changed (for names and messages outside quotes).
    /// </summary>
    public static string Safe(string s)
    {
        var clean = true;
        foreach (var c in s)
            if (NeedsEscape(c)) { clean = false; break; }
        if (clean) return s;
        var sb = new StringBuilder(s.Length + 8);
        AppendEscaped(sb, s, quote: false);
        return sb.ToString();
    }

    private static void AppendEscaped(StringBuilder sb, string s, bool quote)
    {
        for (var i = 0; i < s.Length; i++)
        {
            var c = s[i];
            if (quote && c == '\'') { sb.Append("''"); continue; }
            if (quote && c == '\\') { sb.Append("\\\\"); continue; }
            if (char.IsHighSurrogate(c) && i + 1 < s.Length && char.IsLowSurrogate(s[i + 1]))
            {
                sb.Append(c).Append(s[i + 1]);
                i++;
                continue;
            }
            if (!NeedsEscape(c)) { sb.Append(c); continue; }
            switch (c)
            {
                case '\n': sb.Append("\\n"); break;
                case '\r': sb.Append("\\r"); break;
                case '\t': sb.Append("\\t"); break;
                default:
                    sb.Append("\\u{").Append(((int)c).ToString("X", CultureInfo.InvariantCulture)).Append('}');
                    break;
            }
        }
    }

    /// <summary>
    /// C0 and C1 controls, DEL, lone surrogates, line/paragraph separators and the bidirectional
    /// controls (Unicode Standard Annex #9, "Explicit Directional Formatting"), which could reorder a shown line.
    /// </summary>
    private static bool NeedsEscape(char c) =>
        c < ' ' || (c >= '\u007F' && c <= '\u009F') || char.IsSurrogate(c)
        || c == '\u2028' || c == '\u2029' || (c >= '\u202A' && c <= '\u202E') || (c >= '\u2066' && c <= '\u2069')
        || c == '\u200E' || c == '\u200F' || c == '\u061C' || c == '\uFEFF';

    /// <summary>Parses the text form of one cell (the whole of <paramref name="text"/>) back into a value.</summary>
    public static bool TryParse(ReadOnlySpan<char> text, out Value value, out string? error)
    {
        value = default;
        error = null;
        if (text.IsEmpty) { error = "empty cell"; return false; }
        if (text[0] == '\'')
        {
            var end = ScanQuoted(text, 0, out var s, out error);
            if (end < 0) return false;
            if (end != text.Length) { error = "text after the closing quote"; return false; }
            value = Value.Of(s!);
            return true;
        }
        switch (text)
        {
            case "NaN": value = Value.NaN; return true;
            case "None": value = Value.NoneRef; return true;
            case "null": value = Value.Null; return true;
            case "NaT": value = Value.NaT; return true;
            case "true": value = Value.Of(true); return true;
            case "false": value = Value.Of(false); return true;
            case "float:NaN": value = Value.Of(double.NaN); return true;
            case "float:Infinity": value = Value.Of(double.PositiveInfinity); return true;
            case "float:-Infinity": value = Value.Of(double.NegativeInfinity); return true;
        }
        if (text.Length >= 20 && text[^1] == 'Z' && text[4] == '-' && text[10] == 'T')
        {
            if (TryParseTimestamp(text, out var micros)) { value = Value.Timestamp(micros); return true; }
            error = "not an ISO 8601 UTC timestamp";
            return false;
        }
        foreach (var c in text)
        {
            if (c is '.' or 'E')
            {
                if (double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var d) && double.IsFinite(d)
                    && text.IndexOf('.') >= 0)
                {
                    value = Value.Of(d);
                    return true;
                }
                error = "not a float in round-trip form";
                return false;
            }
        }
        if (long.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out var l))
        {
            value = Value.Of(l);
            return true;
        }
        error = "not a cell: expected 'text', a number, true, false, a timestamp, NaN, None, null or NaT";
        return false;
    }

    /// <summary>
    /// Reads a quoted string starting at <paramref name="start"/> (which must be <c>'</c>); returns the index
    /// just after the closing quote, or -1 with <paramref name="error"/> set.
    /// </summary>
    public static int ScanQuoted(ReadOnlySpan<char> text, int start, out string? result, out string? error)
    {
        result = null;
        error = null;
        if (start >= text.Length || text[start] != '\'') { error = "expected a quote"; return -1; }
        var sb = new StringBuilder();
        var i = start + 1;
        while (i < text.Length)
        {
            var c = text[i];
            if (c == '\'')
            {
                if (i + 1 < text.Length && text[i + 1] == '\'') { sb.Append('\''); i += 2; continue; }
                result = sb.ToString();
                return i + 1;
            }
            if (c == '\\')
            {
                if (i + 1 >= text.Length) { error = "a backslash at the end of the line"; return -1; }
                var e = text[i + 1];
                switch (e)
                {
                    case '\\': sb.Append('\\'); i += 2; continue;
                    case 'n': sb.Append('\n'); i += 2; continue;
                    case 'r': sb.Append('\r'); i += 2; continue;
                    case 't': sb.Append('\t'); i += 2; continue;
                    case 'u':
                    {
                        var close = text[i..].IndexOf('}');
                        if (i + 2 >= text.Length || text[i + 2] != '{' || close < 0)
                        {
                            error = "bad \\u{...} escape";
                            return -1;
                        }
                        var hex = text.Slice(i + 3, close - 3);
                        if (hex.Length is 0 or > 4 || !int.TryParse(hex, NumberStyles.AllowHexSpecifier, CultureInfo.InvariantCulture, out var code))
                        {
                            error = "bad \\u{...} escape";
                            return -1;
                        }
                        sb.Append((char)code);
                        i += close + 1;
                        continue;
                    }
                    default:
                        error = "unknown escape \\" + e;
                        return -1;
                }
            }
            sb.Append(c);
            i++;
        }
        error = "unterminated string";
        return -1;
    }

    private static bool TryParseTimestamp(ReadOnlySpan<char> text, out long micros)
    {
        micros = 0;
        // yyyy-MM-ddTHH:mm:ss[.ffffff]Z, the exact form ValueText.FormatTimestamp writes.
        if (!DateTime.TryParseExact(text[..19], "yyyy-MM-dd'T'HH:mm:ss", CultureInfo.InvariantCulture,
                DateTimeStyles.AdjustToUniversal | DateTimeStyles.AssumeUniversal, out var dt))
            return false;
        long frac = 0;
        var rest = text[19..^1];
        if (!rest.IsEmpty)
        {
            if (rest[0] != '.' || rest.Length < 2 || rest.Length > 7) return false;
            var digits = rest[1..];
            foreach (var c in digits)
                if (c is < '0' or > '9') return false;
            frac = long.Parse(digits, NumberStyles.None, CultureInfo.InvariantCulture);
            for (var k = digits.Length; k < 6; k++) frac *= 10;
        }
        micros = ValueText.ToMicros(new DateTimeOffset(DateTime.SpecifyKind(dt, DateTimeKind.Utc))) + frac;
        return true;
    }
}
