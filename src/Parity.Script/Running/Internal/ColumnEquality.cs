using Parity.Engine.Columns;

namespace Parity.Script.Running.Internal;

/// <summary>Whether two columns show the same contents: same type label, same cells, same missing markers.</summary>
internal static class ColumnEquality
{
    public static bool Same(Column a, Column b)
    {
        if (ReferenceEquals(a, b)) return true;
        if (a.Type != b.Type || a.Length != b.Length) return false;
        if (a is Utf8Column ua && b is Utf8Column ub)
        {
            for (var i = 0; i < ua.Length; i++)
            {
                var m = ua.IsMissing(i);
                if (m != ub.IsMissing(i)) return false;
                if (!m && !ua.GetBytes(i).SequenceEqual(ub.GetBytes(i))) return false;
            }
            return true;
        }
        for (var i = 0; i < a.Length; i++)
            if (!a.GetValue(i).Equals(b.GetValue(i))) return false;
        return true;
    }
}
