namespace Parity.Engine.IO.Internal;

/// <summary>
/// Parses ISO 8601 date-times (ISO 8601-1:2019, extended format) into UTC microseconds since the Unix epoch:
/// <c>YYYY-MM-DD</c>, optionally followed by <c>T</c> (or a space) and <c>hh:mm</c>, <c>hh:mm:ss</c> and a
/// fraction of up to 9 digits (digits past microseconds are truncated), then <c>Z</c> or an offset
/// <c>±hh:mm</c>, <c>±hhmm</c> or <c>±hh</c>. An offset is subtracted to normalise to UTC; a value without
/// one is taken as UTC (we never read the machine's time zone).
/// </summary>
internal static class Iso8601
{
    private const long MicrosPerSecond = 1_000_000;
    private const long MicrosPerDay = 86_400 * MicrosPerSecond;

    public static bool TryParse(ReadOnlySpan<char> s, out long micros)
    {
        micros = 0;
        if (s.Length < 10 || s[4] != '-' || s[7] != '-') return false;
        if (!Digits(s, 0, 4, out var year) || !Digits(s, 5, 2, out var month) || !Digits(s, 8, 2, out var day)) return false;
        if (month is < 1 or > 12 || day < 1 || day > DateTime.DaysInMonth(Math.Max(year, 1), month) || year < 1) return false;
        long time = 0;
        long offset = 0;
        var i = 10;
        if (i < s.Length)
        {
            if (s[i] != 'T' && s[i] != 't' && s[i] != ' ') return false;
            i++;
            if (!Digits(s, i, 2, out var hour) || i + 2 >= s.Length || s[i + 2] != ':' || !Digits(s, i + 3, 2, out var minute)) return false;
            if (hour > 23 || minute > 59) return false;
            i += 5;
            var second = 0;
            long fraction = 0;
            if (i < s.Length && s[i] == ':')
            {
                if (!Digits(s, i + 1, 2, out second) || second > 59) return false;
                i += 3;
                if (i < s.Length && (s[i] == '.' || s[i] == ','))
                {
                    i++;
                    var start = i;
                    long scale = 100_000;
                    while (i < s.Length && char.IsAsciiDigit(s[i]))
                    {
                        fraction += (s[i] - '0') * scale;
                        scale /= 10;
                        i++;
                    }
                    if (i == start || i - start > 9) return false;
                }
            }
            time = ((hour * 60L + minute) * 60 + second) * MicrosPerSecond + fraction;
            if (i < s.Length)
            {
                var c = s[i];
                if (c is 'Z' or 'z')
                {
                    i++;
                }
                else if (c is '+' or '-')
                {
                    var sign = c == '+' ? 1 : -1;
                    i++;
                    if (!Digits(s, i, 2, out var oh) || oh > 23) return false;
                    i += 2;
                    var om = 0;
                    if (i < s.Length)
                    {
                        if (s[i] == ':') i++;
                        if (!Digits(s, i, 2, out om) || om > 59) return false;
                        i += 2;
                    }
                    offset = sign * ((oh * 60L + om) * 60 * MicrosPerSecond);
                }
                else
                {
                    return false;
                }
            }
            if (i != s.Length) return false;
        }
        micros = DaysFromCivil(year, month, day) * MicrosPerDay + time - offset;
        return true;
    }

    /// <summary>Same as the char form, for ASCII bytes (a non-ASCII byte can never be part of a timestamp).</summary>
    public static bool TryParse(ReadOnlySpan<byte> utf8, out long micros)
    {
        micros = 0;
        if (utf8.Length > 64) return false;
        Span<char> chars = stackalloc char[utf8.Length];
        for (var i = 0; i < utf8.Length; i++)
        {
            if (utf8[i] >= 0x80) return false;
            chars[i] = (char)utf8[i];
        }
        return TryParse(chars, out micros);
    }

    private static bool Digits(ReadOnlySpan<char> s, int start, int count, out int value)
    {
        value = 0;
        if (start + count > s.Length) return false;
        for (var i = start; i < start + count; i++)
        {
            if (!char.IsAsciiDigit(s[i])) return false;
            value = value * 10 + (s[i] - '0');
        }
        return true;
    }

    // Days since 1970-01-01 in the proleptic Gregorian calendar (the civil-from-days inverse; common practice, no source).
    private static long DaysFromCivil(int y, int m, int d)
    {
        y -= m <= 2 ? 1 : 0;
        var era = (y >= 0 ? y : y - 399) / 400;
        var yoe = y - era * 400;
        var doy = (153 * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;
        var doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
        return era * 146097L + doe - 719468;
    }
}
