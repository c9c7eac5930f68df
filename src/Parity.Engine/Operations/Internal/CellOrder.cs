using Parity.Engine.Text;

namespace Parity.Engine.Operations.Internal;

/// <summary>
/// Order and equality of boxed cells in a mixed (object) column. Kinds order first: numbers &lt; bools &lt;
/// strings &lt; timestamps; within a kind by value (numbers numerically, an int64 equal to a float64 is the
/// same key; strings in code point order). A NaN double that is a value sorts after every other number.
/// Callers pass non-missing cells only.
/// </summary>
internal sealed class CellOrder : IComparer<object>, IEqualityComparer<object>
{
    public static CellOrder Instance { get; } = new();

    public static int KindOf(object cell) => cell switch
    {
        long or double => 0,
        bool => 1,
        string => 2,
        DateTime => 3,
        _ => 2,
    };

    /// <summary>The kind's name in messages.</summary>
    public static string KindName(int kind) => kind switch
    {
        0 => "numbers",
        1 => "bools",
        3 => "timestamps",
        _ => "strings",
    };

    public int Compare(object? x, object? y)
    {
        if (x is null || y is null) return (x is null ? 1 : 0) - (y is null ? 1 : 0);
        var kx = KindOf(x);
        var ky = KindOf(y);
        if (kx != ky) return kx.CompareTo(ky);
        switch (kx)
        {
            case 0:
                if (x is long lx && y is long ly) return lx.CompareTo(ly);
                return CompareDoubles(ToDouble(x), ToDouble(y));
            case 1:
                return ((bool)x).CompareTo((bool)y);
            case 3:
                return ((DateTime)x).Ticks.CompareTo(((DateTime)y).Ticks);
            default:
                return CodePointOrder.Compare(AsText(x), AsText(y));
        }
    }

    public new bool Equals(object? x, object? y)
    {
        if (x is null || y is null) return x is null && y is null;
        var kx = KindOf(x);
        if (kx != KindOf(y)) return false;
        switch (kx)
        {
            case 0:
                if (x is long lx && y is long ly) return lx == ly;
                var dx = ToDouble(x);
                var dy = ToDouble(y);
                return dx == dy || (double.IsNaN(dx) && double.IsNaN(dy));
            case 1:
                return (bool)x == (bool)y;
            case 3:
                return ((DateTime)x).Ticks == ((DateTime)y).Ticks;
            default:
                return string.Equals(AsText(x), AsText(y), StringComparison.Ordinal);
        }
    }

    public int GetHashCode(object obj) => KindOf(obj) switch
    {
        0 => KeyBits.OfDouble(ToDouble(obj)).GetHashCode(),
        1 => (bool)obj ? 1 : 2,
        3 => ((DateTime)obj).Ticks.GetHashCode(),
        _ => string.GetHashCode(AsText(obj), StringComparison.Ordinal),
    };

    /// <summary>Total order on doubles for sorting: -0.0 equals 0.0, NaN after every number.</summary>
    public static int CompareDoubles(double a, double b)
    {
        if (a < b) return -1;
        if (a > b) return 1;
        if (a == b) return 0;
        return (double.IsNaN(a) ? 1 : 0) - (double.IsNaN(b) ? 1 : 0);
    }

    private static double ToDouble(object o) => o is long l ? l : (double)o;

    private static string AsText(object o) => o as string ?? Convert.ToString(o, System.Globalization.CultureInfo.InvariantCulture) ?? "";
}
