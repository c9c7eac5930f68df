namespace Parity.Engine.Operations.Internal;

/// <summary>Hash-key forms of typed values, so equal values (by the engine's key equality) get equal bits.</summary>
internal static class KeyBits
{
    /// <summary>The one bit pattern every NaN value is keyed on.</summary>
    public static readonly long CanonicalNaN = BitConverter.DoubleToInt64Bits(double.NaN);

    /// <summary>-0.0 and 0.0 are one key; every NaN is one key (IEEE 754 has many NaN payloads).</summary>
    public static long OfDouble(double d) =>
        d == 0 ? 0L : double.IsNaN(d) ? CanonicalNaN : BitConverter.DoubleToInt64Bits(d);
}
