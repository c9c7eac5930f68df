using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Shared key codes for both sides of a join: the right side is inserted into a hash map keyed on typed
/// buffers, the left side only probes it. Code -1 means "matches nothing".
/// </summary>
internal static class JoinKeys
{
    /// <summary>Fills the codes and returns the number of codes (the missing-key code included under <c>nan</c>).</summary>
    public static int Codes(Column left, Column right, Mode mode, out int[] leftCodes, out int[] rightCodes)
    {
        leftCodes = new int[left.Length];
        rightCodes = new int[right.Length];
        int distinct;
        if (left is Utf8Column lu && right is Utf8Column ru)
        {
            var map = new Utf8IdMap();
            map.Code(ru, rightCodes, insert: true, missingCode: -2);
            map.Code(lu, leftCodes, insert: false, missingCode: -2);
            distinct = map.Count;
        }
        else if (LongKind(left) is var lk && LongKind(right) is var rk && lk != 0 && rk != 0 && (lk == rk || (lk <= 2 && rk <= 2)))
        {
            // 1 = int64, 2 = float64 (an int64 key meets a float64 key by value), 3 = bool, 4 = timestamp.
            var asDouble = lk == 2 || rk == 2;
            var map = new LongIdMap();
            CodeLongs(right, asDouble, rightCodes, map, insert: true);
            CodeLongs(left, asDouble, leftCodes, map, insert: false);
            distinct = map.Count;
        }
        else
        {
            var map = new Dictionary<object, int>(CellOrder.Instance);
            CodeCells(right, rightCodes, map, insert: true);
            CodeCells(left, leftCodes, map, insert: false);
            distinct = map.Count;
        }
        // Missing keys were coded -2: under nan they share one code, under null they match nothing.
        var missingCode = mode.IsNan ? distinct : -1;
        Replace(leftCodes, missingCode);
        Replace(rightCodes, missingCode);
        return distinct + 1;
    }

    private static void Replace(int[] codes, int missingCode)
    {
        for (var i = 0; i < codes.Length; i++)
            if (codes[i] == -2) codes[i] = missingCode;
    }

    private static int LongKind(Column c) => c switch
    {
        Int64Column => 1,
        Float64Column => 2,
        BoolColumn => 3,
        TimestampColumn => 4,
        _ => 0,
    };

    private static void CodeLongs(Column column, bool asDouble, int[] codes, LongIdMap map, bool insert)
    {
        switch (column)
        {
            case Float64Column f:
            {
                var span = f.Span;
                var v = f.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                var nanIsMissing = f.Marker == MissingMarker.Nan;
                for (var i = 0; i < codes.Length; i++)
                {
                    var d = span[i];
                    if (!ValidBits.IsValid(vb, vo, i) || (nanIsMissing && double.IsNaN(d))) { codes[i] = -2; continue; }
                    var key = KeyBits.OfDouble(d);
                    codes[i] = insert ? map.GetOrAdd(key) : map.Find(key);
                }
                return;
            }
            case BoolColumn b:
            {
                var span = b.Span;
                var v = b.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                for (var i = 0; i < codes.Length; i++)
                {
                    if (!ValidBits.IsValid(vb, vo, i)) { codes[i] = -2; continue; }
                    var key = span[i] ? 1L : 0L;
                    codes[i] = insert ? map.GetOrAdd(key) : map.Find(key);
                }
                return;
            }
            default:
            {
                var p = (PrimitiveColumn<long>)column;
                var span = p.Span;
                var v = p.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                for (var i = 0; i < codes.Length; i++)
                {
                    if (!ValidBits.IsValid(vb, vo, i)) { codes[i] = -2; continue; }
                    var key = asDouble ? KeyBits.OfDouble(span[i]) : span[i];
                    codes[i] = insert ? map.GetOrAdd(key) : map.Find(key);
                }
                return;
            }
        }
    }

    /// <summary>The general path: cells decoded and keyed with <see cref="CellOrder"/> equality.</summary>
    private static void CodeCells(Column column, int[] codes, Dictionary<object, int> map, bool insert)
    {
        for (var i = 0; i < codes.Length; i++)
        {
            var v = column.GetValue(i);
            if (v.IsMissing) { codes[i] = -2; continue; }
            var cell = v.Kind == ValueKind.String ? v.String : ObjectColumn.ToCell(v)!;
            if (map.TryGetValue(cell, out var id)) { codes[i] = id; continue; }
            if (!insert) { codes[i] = -1; continue; }
            id = map.Count;
            map.Add(cell, id);
            codes[i] = id;
        }
    }
}
