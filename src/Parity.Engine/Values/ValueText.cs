using System.Globalization;

namespace Parity.Engine.Values;

/// <summary>
/// Culture-invariant text forms of values (spec §2.3): floats in shortest round-trip form with at least one
/// fractional digit (<c>3.0</c>), bools <c>true</c>/<c>false</c>, timestamps ISO 8601 with <c>Z</c>.
/// </summary>
public static class ValueText
{
    private static readonly DateTime Epoch = new(1970, 1, 1, 0, 0, 0, DateTimeKind.Utc);

    /// <summary>The text of a non-missing value as <c>text(x)</c> gives it; missing values give their marker name.</summary>
    public static string Format(Value v) => v.Kind switch
    {
        ValueKind.Int64 => v.Int64.ToString(CultureInfo.InvariantCulture),
        ValueKind.Float64 => FormatFloat(v.Float64),
        ValueKind.Bool => v.Bool ? "true" : "false",
        ValueKind.String => v.String,
        ValueKind.Timestamp => FormatTimestamp(v.TimestampMicros),
        _ => MissingName(v.Missing),
    };

    /// <summary>The printed name of a missing marker: <c>NaN</c>, <c>None</c>, <c>null</c>, <c>NaT</c>.</summary>
    public static string MissingName(MissingKind kind) => kind switch
    {
        MissingKind.NaN => "NaN",
        MissingKind.NoneRef => "None",
        MissingKind.Null => "null",
        MissingKind.NaT => "NaT",
        _ => "",
    };

    /// <summary>Shortest round-trip form with at least one fractional digit; <c>NaN</c>, <c>Infinity</c>, <c>-Infinity</c>.</summary>
    public static string FormatFloat(double d)
    {
        if (double.IsNaN(d)) return "NaN";
        if (double.IsPositiveInfinity(d)) return "Infinity";
        if (double.IsNegativeInfinity(d)) return "-Infinity";
        var s = d.ToString("R", CultureInfo.InvariantCulture);
        if (s.Contains('E', StringComparison.Ordinal))
        {
            // "1E+20" -> "1.0E+20": keep a fractional digit in the mantissa.
            var e = s.IndexOf('E', StringComparison.Ordinal);
            var mantissa = s[..e];
            if (!mantissa.Contains('.', StringComparison.Ordinal)) mantissa += ".0";
            return mantissa + s[e..];
        }
        return s.Contains('.', StringComparison.Ordinal) ? s : s + ".0";
    }

    /// <summary>ISO 8601, UTC, with a <c>Z</c>; fractional seconds only when present (up to microseconds).</summary>
    public static string FormatTimestamp(long micros)
    {
        var dt = Epoch.AddTicks(micros * 10);
        var frac = micros % 1_000_000;
        if (frac < 0) frac += 1_000_000;
        if (frac == 0)
            return dt.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture);
        var digits = frac.ToString("D6", CultureInfo.InvariantCulture).TrimEnd('0');
        return dt.ToString("yyyy-MM-dd'T'HH:mm:ss", CultureInfo.InvariantCulture) + "." + digits + "Z";
    }

    /// <summary>Microseconds since the Unix epoch for a UTC instant.</summary>
    public static long ToMicros(DateTimeOffset instant) => (instant.UtcTicks - Epoch.Ticks) / 10;

    public static DateTime FromMicros(long micros) => Epoch.AddTicks(micros * 10);
}
