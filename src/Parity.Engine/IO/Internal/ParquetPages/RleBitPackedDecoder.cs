namespace Parity.Engine.IO.Internal.ParquetPages;

/// <summary>
/// Parquet format, "Run Length Encoding / Bit-Packing Hybrid (RLE = 3)": a sequence of runs, each a varint header
/// whose low bit says a repeated value (count = header &gt;&gt; 1, the value in ceil(width / 8) little-endian bytes)
/// or bit-packed groups of eight values (groups = header &gt;&gt; 1, packed least significant bit first). Used for
/// definition levels and dictionary indices.
/// </summary>
internal static class RleBitPackedDecoder
{
    /// <summary>
    /// Fills <paramref name="destination"/> with exactly its length of values; the last bit-packed group may hold
    /// padding past it. Throws <see cref="InvalidDataException"/> when the runs end first.
    /// </summary>
    public static void Decode(ReadOnlySpan<byte> data, int bitWidth, Span<int> destination)
    {
        if (bitWidth is < 0 or > 32) throw new InvalidDataException("bit width " + bitWidth + " is out of range");
        var pos = 0;
        var filled = 0;
        var valueBytes = (bitWidth + 7) >> 3;
        var mask = bitWidth == 32 ? uint.MaxValue : (1u << bitWidth) - 1;
        while (filled < destination.Length)
        {
            var header = ReadVarint(data, ref pos);
            if ((header & 1) == 0)
            {
                var count = header >> 1;
                if (valueBytes > data.Length - pos) throw Truncated();
                uint value = 0;
                for (var b = 0; b < valueBytes; b++) value |= (uint)data[pos + b] << (8 * b);
                pos += valueBytes;
                var take = (int)Math.Min(count, (ulong)(destination.Length - filled));
                destination.Slice(filled, take).Fill((int)(value & mask));
                filled += take;
            }
            else
            {
                var groups = header >> 1;
                var bytes = groups * (ulong)bitWidth;
                if (bytes > (ulong)(data.Length - pos)) throw Truncated();
                var packed = data.Slice(pos, (int)bytes);
                pos += (int)bytes;
                var take = (int)Math.Min(groups * 8, (ulong)(destination.Length - filled));
                Unpack(packed, bitWidth, mask, destination.Slice(filled, take));
                filled += take;
            }
        }
    }

    private static void Unpack(ReadOnlySpan<byte> packed, int bitWidth, uint mask, Span<int> destination)
    {
        if (bitWidth == 0)
        {
            destination.Clear();
            return;
        }
        ulong window = 0;
        var bits = 0;
        var at = 0;
        for (var i = 0; i < destination.Length; i++)
        {
            while (bits < bitWidth)
            {
                window |= (ulong)packed[at++] << bits;
                bits += 8;
            }
            destination[i] = (int)((uint)window & mask);
            window >>= bitWidth;
            bits -= bitWidth;
        }
    }

    private static ulong ReadVarint(ReadOnlySpan<byte> data, ref int pos)
    {
        ulong result = 0;
        for (var shift = 0; shift < 64; shift += 7)
        {
            if (pos >= data.Length) throw Truncated();
            var b = data[pos++];
            result |= (ulong)(b & 0x7F) << shift;
            if ((b & 0x80) == 0) return result;
        }
        throw new InvalidDataException("a run header longer than 10 bytes");
    }

    private static InvalidDataException Truncated() => new("levels or indices end before their values");
}
