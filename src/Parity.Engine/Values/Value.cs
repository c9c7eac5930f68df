using System.Globalization;

namespace Parity.Engine.Values;

/// <summary>
/// One cell, decoded. Used by generic (non-kernel) paths, reports and tests; kernels work on column buffers.
/// Timestamps are microseconds since 1970-01-01T00:00:00Z.
/// </summary>
public readonly struct Value : IEquatable<Value>
{
    private readonly long _int;
    private readonly double _float;
    private readonly string? _string;

    private Value(ValueKind kind, MissingKind missing, long i, double f, string? s)
    {
        Kind = kind;
        Missing = missing;
        _int = i;
        _float = f;
        _string = s;
    }

    public ValueKind Kind { get; }

    /// <summary>The missing marker when <see cref="Kind"/> is <see cref="ValueKind.Missing"/>, else <see cref="MissingKind.None"/>.</summary>
    public MissingKind Missing { get; }

    public bool IsMissing => Kind == ValueKind.Missing;

    public long Int64 => _int;

    public double Float64 => _float;

    public bool Bool => _int != 0;

    public string String => _string ?? "";

    public long TimestampMicros => _int;

    public static Value Of(long v) => new(ValueKind.Int64, MissingKind.None, v, 0, null);

    public static Value Of(double v) => new(ValueKind.Float64, MissingKind.None, 0, v, null);

    public static Value Of(bool v) => new(ValueKind.Bool, MissingKind.None, v ? 1 : 0, 0, null);

    public static Value Of(string v) => new(ValueKind.String, MissingKind.None, 0, 0, v);

    public static Value Timestamp(long micros) => new(ValueKind.Timestamp, MissingKind.None, micros, 0, null);

    public static Value MissingOf(MissingKind kind) => new(ValueKind.Missing, kind, 0, double.NaN, null);

    public static Value NaN { get; } = MissingOf(MissingKind.NaN);

    public static Value NoneRef { get; } = MissingOf(MissingKind.NoneRef);

    public static Value Null { get; } = MissingOf(MissingKind.Null);

    public static Value NaT { get; } = MissingOf(MissingKind.NaT);

    /// <summary>True for numbers (int64 or float64 values).</summary>
    public bool IsNumber => Kind is ValueKind.Int64 or ValueKind.Float64;

    /// <summary>The number as a double (int64 widened).</summary>
    public double AsDouble => Kind == ValueKind.Int64 ? _int : _float;

    /// <summary>Exact equality: same kind, same missing marker, same bits for floats (NaN equals NaN here).</summary>
    public bool Equals(Value other)
    {
        if (Kind != other.Kind || Missing != other.Missing)
            return false;
        return Kind switch
        {
            ValueKind.Missing => true,
            ValueKind.Float64 => _float.Equals(other._float),
            ValueKind.String => string.Equals(_string, other._string, StringComparison.Ordinal),
            _ => _int == other._int,
        };
    }

    public override bool Equals(object? obj) => obj is Value v && Equals(v);

    public override int GetHashCode() => Kind switch
    {
        ValueKind.Missing => HashCode.Combine(Kind, Missing),
        ValueKind.Float64 => HashCode.Combine(Kind, _float),
        ValueKind.String => HashCode.Combine(Kind, string.GetHashCode(_string, StringComparison.Ordinal)),
        _ => HashCode.Combine(Kind, _int),
    };

    public static bool operator ==(Value left, Value right) => left.Equals(right);

    public static bool operator !=(Value left, Value right) => !left.Equals(right);

    /// <summary>A debugging form; reports use <see cref="ValueText"/>.</summary>
    public override string ToString() => Kind switch
    {
        ValueKind.Missing => Missing.ToString(),
        ValueKind.String => "'" + _string + "'",
        _ => ValueText.Format(this),
    };

    internal static string Invariant(long v) => v.ToString(CultureInfo.InvariantCulture);
}
