namespace Parity.Harness.Diffing;

/// <summary>How strictly the differ compares values.</summary>
public sealed record DiffOptions
{
    public static DiffOptions Default { get; } = new();

    /// <summary>
    /// Largest absolute difference <c>|a - b|</c> under which two numbers count as equal when at least one is
    /// a float64 (int64 against int64 is always exact). 0 means exact.
    /// </summary>
    public double FloatTolerance { get; init; }

    /// <summary>Most sample rows kept per finding.</summary>
    public int MaxSamples { get; init; } = 5;

    /// <summary>Tests: skip the typed fast pass and classify every row generically (the results must not change).</summary>
    internal bool GenericOnly { get; init; }
}
