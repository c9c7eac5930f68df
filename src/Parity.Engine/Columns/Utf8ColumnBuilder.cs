using System.Text;
using Apache.Arrow;
using Parity.Engine.Modes;

namespace Parity.Engine.Columns;

/// <summary>Builds a <see cref="Utf8Column"/> into pre-sized, growable buffers (offsets, bytes, validity).</summary>
public sealed class Utf8ColumnBuilder
{
    private int[] _offsets;
    private byte[] _data;
    private byte[]? _validity;
    private int _count;
    private int _bytes;
    private int _nulls;

    public Utf8ColumnBuilder(int capacity, int byteCapacity)
    {
        _offsets = new int[Math.Max(capacity, 4) + 1];
        _data = new byte[Math.Max(byteCapacity, 16)];
    }

    public int Count => _count;

    public void Append(ReadOnlySpan<byte> utf8)
    {
        EnsureSlots();
        EnsureBytes(utf8.Length);
        utf8.CopyTo(_data.AsSpan(_bytes));
        _bytes += utf8.Length;
        MarkValid();
        _count++;
        _offsets[_count] = _bytes;
    }

    public void Append(string s)
    {
        EnsureSlots();
        EnsureBytes(Encoding.UTF8.GetMaxByteCount(s.Length));
        _bytes += Encoding.UTF8.GetBytes(s, _data.AsSpan(_bytes));
        MarkValid();
        _count++;
        _offsets[_count] = _bytes;
    }

    public void AppendMissing()
    {
        EnsureSlots();
        if (_validity is null)
        {
            _validity = new byte[(_offsets.Length + 7) >> 3];
            for (var i = 0; i < _count; i++) _validity[i >> 3] |= (byte)(1 << (i & 7));
        }
        _nulls++;
        _count++;
        _offsets[_count] = _bytes;
    }

    /// <summary>Reserves room for <paramref name="extra"/> more bytes and returns the writable tail.</summary>
    public Span<byte> Reserve(int extra)
    {
        EnsureBytes(extra);
        return _data.AsSpan(_bytes);
    }

    /// <summary>Commits a value of <paramref name="length"/> bytes written into <see cref="Reserve"/>'s span.</summary>
    public void Commit(int length)
    {
        EnsureSlots();
        _bytes += length;
        MarkValid();
        _count++;
        _offsets[_count] = _bytes;
    }

    public Utf8Column Build(MissingMarker marker)
    {
        var validity = _validity is null ? Validity.AllValid(_count) : new Validity(_validity, 0, _count);
        return FromBuffers(_offsets.AsMemory(0, _count + 1), _data.AsMemory(0, _bytes), validity, marker, _nulls);
    }

    /// <summary>Wraps existing buffers (offsets relative to <paramref name="data"/>) without copying.</summary>
    public static Utf8Column FromBuffers(ReadOnlyMemory<int> offsets, ReadOnlyMemory<byte> data, Validity validity, MissingMarker marker, int nullCount = -1)
    {
        var length = offsets.Length - 1;
        if (nullCount < 0) nullCount = validity.NullCount;
        var offsetBytes = Int32ByteMemory.Of(offsets);
        var bitmap = ArrowBuffer.Empty;
        var bitOffset = 0;
        if (nullCount > 0)
        {
            var c = validity.Compact();
            bitmap = new ArrowBuffer(c.Bits);
            bitOffset = c.BitOffset;
        }
        var array = new StringArray(length, new ArrowBuffer(offsetBytes), new ArrowBuffer(data), bitmap, nullCount, bitOffset);
        return new Utf8Column(array, marker);
    }

    private void MarkValid()
    {
        if (_validity is not null) _validity[_count >> 3] |= (byte)(1 << (_count & 7));
    }

    private void EnsureSlots()
    {
        if (_count + 2 > _offsets.Length)
        {
            System.Array.Resize(ref _offsets, _offsets.Length * 2);
        }
        if (_validity is not null)
        {
            if (((_count + 8) >> 3) > _validity.Length)
                System.Array.Resize(ref _validity, Math.Max(_validity.Length * 2, (_offsets.Length + 7) >> 3));
            // The slot being appended starts valid; AppendMissing leaves it clear.
        }
    }

    private void EnsureBytes(int extra)
    {
        var need = (long)_bytes + extra;
        if (need <= _data.Length) return;
        var grown = Math.Min(Math.Max(2L * _data.Length, need), System.Array.MaxLength);
        System.Array.Resize(ref _data, CheckedSize(Math.Max(grown, need)));
    }

    /// <summary>
    /// A byte count that fits one Arrow UTF-8 array, or E-LIMIT: its offsets are 32-bit (Apache Arrow columnar
    /// format, variable-size binary layout), so one column holds at most about 2 GiB of text.
    /// </summary>
    public static int CheckedSize(long bytes)
    {
        if (bytes <= System.Array.MaxLength) return (int)bytes;
        throw new Errors.EngineException(Errors.ErrorCodes.Limit, string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"a string column would hold {bytes} bytes of UTF-8 text, more than the {System.Array.MaxLength} bytes one column can hold (32-bit offsets); use fewer or shorter strings"));
    }
}
