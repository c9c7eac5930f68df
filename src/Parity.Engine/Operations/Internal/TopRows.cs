namespace Parity.Engine.Operations.Internal;

/// <summary>
/// The smallest <c>capacity</c> rows by (class, key, row), kept in a bounded max-heap while rows are offered once
/// each: the first N entries of a stable sort without sorting every row. Classes order what keys cannot (values,
/// then a NaN value, then missing); the row breaks ties, so equal keys keep input order.
/// </summary>
internal sealed class TopRows
{
    private readonly ulong[] _keys;
    private readonly int[] _classes;
    private readonly int[] _rows;
    private int _count;

    public TopRows(int capacity)
    {
        _keys = new ulong[capacity];
        _classes = new int[capacity];
        _rows = new int[capacity];
    }

    /// <summary>Offers a row; rows must come in increasing row order (so a later equal entry never displaces one).</summary>
    public void Offer(int cls, ulong key, int row)
    {
        if (_count < _rows.Length)
        {
            Set(_count, cls, key, row);
            SiftUp(_count++);
            return;
        }
        // The root is the largest kept entry: most rows of a large table stop at this one comparison.
        if (_rows.Length == 0 || cls > _classes[0] || (cls == _classes[0] && key >= _keys[0])) return;
        Set(0, cls, key, row);
        SiftDown(0);
    }

    /// <summary>The kept rows in sort order.</summary>
    public int[] SortedRows()
    {
        var order = new int[_count];
        for (var i = 0; i < order.Length; i++) order[i] = i;
        Array.Sort(order, (a, b) => Less(a, b) ? -1 : Less(b, a) ? 1 : 0);
        var rows = new int[_count];
        for (var i = 0; i < rows.Length; i++) rows[i] = _rows[order[i]];
        return rows;
    }

    private bool Less(int a, int b) =>
        _classes[a] != _classes[b] ? _classes[a] < _classes[b] : _keys[a] != _keys[b] ? _keys[a] < _keys[b] : _rows[a] < _rows[b];

    private void Set(int at, int cls, ulong key, int row)
    {
        _classes[at] = cls;
        _keys[at] = key;
        _rows[at] = row;
    }

    private void Swap(int a, int b)
    {
        (_classes[a], _classes[b]) = (_classes[b], _classes[a]);
        (_keys[a], _keys[b]) = (_keys[b], _keys[a]);
        (_rows[a], _rows[b]) = (_rows[b], _rows[a]);
    }

    private void SiftUp(int at)
    {
        while (at > 0)
        {
            var parent = (at - 1) >> 1;
            if (!Less(parent, at)) return;
            Swap(parent, at);
            at = parent;
        }
    }

    private void SiftDown(int at)
    {
        while (true)
        {
            var largest = at;
            var left = 2 * at + 1;
            if (left < _count && Less(largest, left)) largest = left;
            if (left + 1 < _count && Less(largest, left + 1)) largest = left + 1;
            if (largest == at) return;
            Swap(largest, at);
            at = largest;
        }
    }
}
