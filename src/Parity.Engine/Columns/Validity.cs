using System.Numerics;

namespace Parity.Engine.Columns;

/// <summary>
/// A validity bitmap view: bit set = valid, least significant bit first within each byte
/// (Apache Arrow columnar format, "Validity bitmaps"). No bits at all means every slot is valid.
/// </summary>
public readonly struct Validity
{
    private readonly ReadOnlyMemory<byte> _bits;
    private readonly int _bitOffset;

    public Validity(ReadOnlyMemory<byte> bits, int bitOffset, int length)
    {
        _bits = bits;
        _bitOffset = bitOffset;
        Length = length;
    }

    public static Validity AllValid(int length) => new(ReadOnlyMemory<byte>.Empty, 0, length);

    public int Length { get; }

    /// <summary>False when every slot is valid and no bitmap is kept.</summary>
    public bool HasBitmap => !_bits.IsEmpty;

    public ReadOnlyMemory<byte> Bits => _bits;

    public int BitOffset => _bitOffset;

    public bool IsValid(int index)
    {
        if (_bits.IsEmpty) return true;
        var bit = _bitOffset + index;
        return (_bits.Span[bit >> 3] & (1 << (bit & 7))) != 0;
    }

    public Validity Slice(int offset, int length) =>
        _bits.IsEmpty ? AllValid(length) : new Validity(_bits, _bitOffset + offset, length);

    /// <summary>Number of invalid (missing) slots.</summary>
    public int NullCount
    {
        get
        {
            if (_bits.IsEmpty) return 0;
            var span = _bits.Span;
            var valid = 0;
            var i = 0;
            // Unaligned head, then whole bytes, then the tail.
            for (; i < Length && ((_bitOffset + i) & 7) != 0; i++)
                if ((span[(_bitOffset + i) >> 3] & (1 << ((_bitOffset + i) & 7))) != 0) valid++;
            for (; i + 8 <= Length; i += 8)
                valid += BitOperations.PopCount(span[(_bitOffset + i) >> 3]);
            for (; i < Length; i++)
                if ((span[(_bitOffset + i) >> 3] & (1 << ((_bitOffset + i) & 7))) != 0) valid++;
            return Length - valid;
        }
    }

    /// <summary>Builds a bitmap from per-slot flags; returns <see cref="AllValid"/> when nothing is missing.</summary>
    public static Validity FromFlags(ReadOnlySpan<bool> valid)
    {
        var any = valid.IndexOf(false) >= 0;
        if (!any) return AllValid(valid.Length);
        var bits = new byte[(valid.Length + 7) >> 3];
        for (var i = 0; i < valid.Length; i++)
            if (valid[i]) bits[i >> 3] |= (byte)(1 << (i & 7));
        return new Validity(bits, 0, valid.Length);
    }

    /// <summary>A compact copy with bit offset 0 (or no bitmap when all are valid).</summary>
    public Validity Compact()
    {
        if (_bits.IsEmpty) return this;
        if (NullCount == 0) return AllValid(Length);
        if (_bitOffset == 0 && _bits.Length == (Length + 7) >> 3) return this;
        var bits = new byte[(Length + 7) >> 3];
        for (var i = 0; i < Length; i++)
            if (IsValid(i)) bits[i >> 3] |= (byte)(1 << (i & 7));
        return new Validity(bits, 0, Length);
    }
}
