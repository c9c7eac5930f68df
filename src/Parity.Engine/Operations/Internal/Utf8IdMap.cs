using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics.X86;
using Parity.Engine.Columns;

namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Open-addressing map from UTF-8 byte strings to dense ids in order of first insertion. Each distinct key is
/// copied once into an arena, so lookups never decode a string and the map outlives the source columns.
/// A lookup is bound by memory latency (over 100 ns a dependent miss on the machines we measure), so a slot holds
/// the hash, id and arena position of its key (one miss to reach the bytes, not three), and
/// <see cref="Code"/> hashes a few rows ahead and prefetches their slots.
/// </summary>
internal sealed class Utf8IdMap
{
    /// <summary>Rows hashed ahead of the one being looked up (a power of two).</summary>
    private const int Lookahead = 16;

    private Slot[] _slots;
    private int[] _offsets; // arena offsets by id, Count + 1 entries
    private byte[] _arena;
    private int _count;

    public Utf8IdMap(int capacityHint = 256)
    {
        var cap = 16;
        while (cap < capacityHint * 2 && cap < (1 << 30)) cap <<= 1;
        _slots = new Slot[cap];
        _offsets = new int[Math.Max(8, cap / 2) + 1];
        _arena = new byte[1024];
    }

    public int Count => _count;

    public byte[] Arena => _arena;

    /// <summary>Arena offsets by id (<see cref="Count"/> + 1 entries are meaningful).</summary>
    public int[] Offsets => _offsets;

    /// <summary>
    /// Every value of <paramref name="column"/> as its id: inserted when <paramref name="insert"/>, else -1 when the
    /// map lacks it; <paramref name="missingCode"/> for a missing value.
    /// </summary>
    public void Code(Utf8Column column, Span<int> codes, bool insert, int missingCode)
    {
        var n = column.Length;
        ReadOnlySpan<int> offsets = column.Offsets;
        var data = column.Data;
        var array = column.Array;
        var anyNull = array.NullCount > 0;
        Span<uint> ahead = stackalloc uint[Lookahead];
        for (var i = 0; i < Math.Min(Lookahead, n); i++) ahead[i] = HashAndPrefetch(data[offsets[i]..offsets[i + 1]]);
        for (var i = 0; i < n; i++)
        {
            var h = ahead[i & (Lookahead - 1)];
            var next = i + Lookahead;
            if (next < n) ahead[next & (Lookahead - 1)] = HashAndPrefetch(data[offsets[next]..offsets[next + 1]]);
            if (anyNull && array.IsNull(i))
            {
                codes[i] = missingCode;
                continue;
            }
            var key = data[offsets[i]..offsets[i + 1]];
            codes[i] = insert ? GetOrAdd(key, h) : Find(key, h);
        }
    }

    private uint HashAndPrefetch(ReadOnlySpan<byte> key)
    {
        var h = Hash(key);
        Prefetch(h);
        return h;
    }

    /// <summary>
    /// A hint to bring the slot where <paramref name="hash"/> starts its probe into the cache. The array is not pinned:
    /// if the collector moves it (or the map grows) the hint is merely wasted; a prefetch never faults.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private unsafe void Prefetch(uint hash)
    {
        if (!Sse.IsSupported) return;
        Sse.Prefetch0(Unsafe.AsPointer(ref _slots[(int)(hash & (uint)(_slots.Length - 1))]));
    }

    private int GetOrAdd(ReadOnlySpan<byte> key, uint h)
    {
        var slots = _slots;
        var mask = slots.Length - 1;
        var i = (int)(h & (uint)mask);
        while (true)
        {
            ref var s = ref slots[i];
            if (s.IdPlusOne == 0) break;
            if (s.Hash == h && s.Length == key.Length && _arena.AsSpan(s.Offset, s.Length).SequenceEqual(key)) return s.IdPlusOne - 1;
            i = (i + 1) & mask;
        }
        var id = _count;
        if (id + 1 == _offsets.Length) Array.Resize(ref _offsets, (_offsets.Length - 1) * 2 + 1);
        var start = _offsets[id];
        if (start + key.Length > _arena.Length) Array.Resize(ref _arena, Math.Max(_arena.Length * 2, start + key.Length));
        key.CopyTo(_arena.AsSpan(start));
        _offsets[id + 1] = start + key.Length;
        slots[i] = new Slot(h, id + 1, start, key.Length);
        _count++;
        if (_count * 2 > slots.Length) Grow();
        return id;
    }

    private int Find(ReadOnlySpan<byte> key, uint h)
    {
        var slots = _slots;
        var mask = slots.Length - 1;
        var i = (int)(h & (uint)mask);
        while (true)
        {
            ref var s = ref slots[i];
            if (s.IdPlusOne == 0) return -1;
            if (s.Hash == h && s.Length == key.Length && _arena.AsSpan(s.Offset, s.Length).SequenceEqual(key)) return s.IdPlusOne - 1;
            i = (i + 1) & mask;
        }
    }

    private void Grow()
    {
        var old = _slots;
        _slots = new Slot[old.Length * 2];
        var mask = _slots.Length - 1;
        foreach (var s in old)
        {
            if (s.IdPlusOne == 0) continue;
            var i = (int)(s.Hash & (uint)mask);
            while (_slots[i].IdPlusOne != 0) i = (i + 1) & mask;
            _slots[i] = s;
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

    /// <summary>One key's place: its hash, id + 1 (0 = empty slot) and bytes in the arena; 16 bytes, four to a cache line.</summary>
    [StructLayout(LayoutKind.Sequential)]
    private readonly record struct Slot(uint Hash, int IdPlusOne, int Offset, int Length);
}
