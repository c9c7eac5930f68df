using System.Runtime.CompilerServices;

namespace Parity.Engine.Operations.Internal;

/// <summary>Validity bitmap reads on a span taken once per kernel (Arrow columnar format: bit set = valid, LSB first).</summary>
internal static class ValidBits
{
    /// <summary>True when slot <paramref name="i"/> is valid; an empty bitmap means every slot is valid.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static bool IsValid(ReadOnlySpan<byte> bits, int bitOffset, int i)
    {
        if (bits.IsEmpty) return true;
        var b = bitOffset + i;
        return (bits[b >> 3] & (1 << (b & 7))) != 0;
    }
}
