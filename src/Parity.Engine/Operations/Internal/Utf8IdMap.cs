using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Open-addressing map from UTF-8 byte strings to dense ids in order of first insertion. Each distinct key is
/// copied once into an arena, so lookups never decode a string and the map outlives the source columns.
/// </summary>
internal sealed class Utf8IdMap
{
    private int[] _slots; // id + 1, 0 = empty
    private uint[] _hashes;
    private int[] _offsets; // arena offsets by id, Count + 1 entries
    private byte[] _arena;
    private int _count;

    public Utf8IdMap(int capacityHint = 256)
    {
        var cap = 16;
        while (cap < capacityHint * 2 && cap < (1 << 30)) cap <<= 1;
        _slots = new int[cap];
        _hashes = new uint[Math.Max(8, cap / 2)];
        _offsets = new int[_hashes.Length + 1];
        _arena = new byte[1024];
    }

    public int Count => _count;

    public byte[] Arena => _arena;

    /// <summary>Arena offsets by id (<see cref="Count"/> + 1 entries are meaningful).</summary>
    public int[] Offsets => _offsets;

    public ReadOnlySpan<byte> KeyOf(int id) => _arena.AsSpan(_offsets[id], _offsets[id + 1] - _offsets[id]);

    public int GetOrAdd(ReadOnlySpan<byte> key)
    {
        var h = Hash(key);
        var mask = _slots.Length - 1;
        var i = (int)(h & (uint)mask);
        while (true)
        {
            var s = _slots[i];
            if (s == 0) break;
            if (_hashes[s - 1] == h && KeyOf(s - 1).SequenceEqual(key)) return s - 1;
            i = (i + 1) & mask;
        }
        var id = _count;
        if (id == _hashes.Length)
        {
            Array.Resize(ref _hashes, _hashes.Length * 2);
            Array.Resize(ref _offsets, _hashes.Length + 1);
        }
        var start = _offsets[id];
        if (start + key.Length > _arena.Length) Array.Resize(ref _arena, Math.Max(_arena.Length * 2, start + key.Length));
        key.CopyTo(_arena.AsSpan(start));
        _offsets[id + 1] = start + key.Length;
        _hashes[id] = h;
        _slots[i] = id + 1;
        _count++;
        if (_count * 2 > _slots.Length) Grow();
        return id;
    }

    public int Find(ReadOnlySpan<byte> key)
    {
        var h = Hash(key);
        var mask = _slots.Length - 1;
        var i = (int)(h & (uint)mask);
        while (true)
        {
            var s = _slots[i];
            if (s == 0) return -1;
            if (_hashes[s - 1] == h && KeyOf(s - 1).SequenceEqual(key)) return s - 1;
            i = (i + 1) & mask;
        }
    }

    private void Grow()
    {
        var cap = _slots.Length * 2;
        _slots = new int[cap];
        var mask = cap - 1;
        for (var id = 0; id < _count; id++)
        {
            var i = (int)(_hashes[id] & (uint)mask);
            while (_slots[i] != 0) i = (i + 1) & mask;
            _slots[i] = id + 1;
        }
    }

    /// <summary>A fast non-cryptographic hash: 8 bytes at a time, multiply-xorshift mixing, final avalanche.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static uint Hash(ReadOnlySpan<byte> s)
    {
        var h = (ulong)s.Length * 0x9E3779B97F4A7C15UL;
        var i = 0;
        for (; i + 8 <= s.Length; i += 8)
        {
            h = (h ^ MemoryMarshal.Read<ulong>(s[i..])) * 0xFF51AFD7ED558CCDUL;
            h ^= h >> 29;
        }
        if (i < s.Length)
        {
            ulong t = 0;
            for (; i < s.Length; i++) t = (t << 8) | s[i];
            h = (h ^ t) * 0xC4CEB9FE1A85EC53UL;
        }
        h ^= h >> 32;
        h *= 0x9E3779B97F4A7C15UL;
        return (uint)(h >> 32);
    }
}
