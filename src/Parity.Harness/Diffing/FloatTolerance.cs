namespace Parity.Harness.Diffing;

/// <summary>
/// When two numbers count as equal (docs/workflow.md, "Tolerance"): <c>|a - b| &lt;= max(Absolute,
/// Relative * max(|a|, |b|))</c>. Both 0 means exact. Non-finite values are equal only to themselves (a NaN
/// value to a NaN value); missing markers never meet this rule (they are compared as markers).
/// </summary>
public readonly record struct FloatTolerance(double Absolute, double Relative)
{
    public static FloatTolerance Exact { get; } = new(0, 0);

    public bool IsExact => Absolute == 0 && Relative == 0;

    public bool Equal(double x, double y)
    {
        if (double.IsNaN(x) || double.IsNaN(y)) return double.IsNaN(x) && double.IsNaN(y);
        if (x == y) return true;
        if (IsExact || !double.IsFinite(x) || !double.IsFinite(y)) return false;
        var allowed = Math.Max(Absolute, Relative * Math.Max(Math.Abs(x), Math.Abs(y)));
        return Math.Abs(x - y) <= allowed;
    }
}
