namespace Parity.Benchmarks.Quick;

/// <summary>Every ratio of the quick mode, in the order of the performance targets.</summary>
public static class RatioCatalog
{
    public static IReadOnlyList<Ratio> All() =>
    [
    ];
}
