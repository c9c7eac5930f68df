using System.Runtime.CompilerServices;

namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Open-addressing map from a 64-bit key to a dense id (0, 1, 2, … in order of first insertion). Keys live in
/// one array indexed by id, so the distinct keys can be sorted afterwards without a second pass over rows.
/// </summary>
internal sealed class LongIdMap
{
    private int[] _slots; // id + 1, 0 = empty
    private long[] _keys;
    private int _count;
    private int _shift;

    public LongIdMap(int capacityHint = 256)
    {
        var cap = 16;
        while (cap < capacityHint * 2 && cap < (1 << 30)) cap <<= 1;
        _slots = new int[cap];
        _shift = 64 - BitLog2(cap);
        _keys = new long[Math.Max(8, cap / 2)];
    }

    public int Count => _count;

    public ReadOnlySpan<long> Keys => _keys.AsSpan(0, _count);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private int Slot(long key) => (int)(((ulong)key * 0x9E3779B97F4A7C15UL) >> _shift);

    public int GetOrAdd(long key)
    {
        var slots = _slots;
        var mask = slots.Length - 1;
        var i = Slot(key);
        while (true)
        {
            var s = slots[i];
            if (s == 0) break;
            if (_keys[s - 1] == key) return s - 1;
            i = (i + 1) & mask;
        }
        var id = _count;
        if (id == _keys.Length) Array.Resize(ref _keys, _keys.Length * 2);
        _keys[id] = key;
        slots[i] = id + 1;
        _count++;
        if (_count * 2 > slots.Length) Grow();
        return id;
    }

    public int Find(long key)
    {
        var slots = _slots;
        var mask = slots.Length - 1;
        var i = Slot(key);
        while (true)
        {
            var s = slots[i];
            if (s == 0) return -1;
            if (_keys[s - 1] == key) return s - 1;
            i = (i + 1) & mask;
        }
    }

    private void Grow()
    {
        var cap = _slots.Length * 2;
        _slots = new int[cap];
        _shift = 64 - BitLog2(cap);
        var mask = cap - 1;
        for (var id = 0; id < _count; id++)
        {
            var i = Slot(_keys[id]);
            while (_slots[i] != 0) i = (i + 1) & mask;
            _slots[i] = id + 1;
        }
    }

    private static int BitLog2(int pow2) => System.Numerics.BitOperations.Log2((uint)pow2);
}
