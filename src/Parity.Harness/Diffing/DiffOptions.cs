namespace Parity.Harness.Diffing;

/// <summary>How strictly the differ and the golden comparison compare values.</summary>
public sealed record DiffOptions
{
    public static DiffOptions Default { get; } = new();

    /// <summary>
    /// Largest absolute difference <c>|a - b|</c> under which two numbers count as equal when at least one is
    /// a float64 (int64 against int64 is always exact). 0 means exact. <c>--float-tolerance</c>.
    /// </summary>
    public double FloatTolerance { get; init; }

    /// <summary>
    /// Largest difference relative to the larger magnitude, <c>|a - b| / max(|a|, |b|)</c>, under which two
    /// numbers count as equal (same scope as <see cref="FloatTolerance"/>). 0 means exact. <c>--float-relative-tolerance</c>.
    /// </summary>
    public double RelativeTolerance { get; init; }

    /// <summary>
    /// A tolerance per column name (the project file's per-column rules); null, or a null answer, means the
    /// global <see cref="FloatTolerance"/> and <see cref="RelativeTolerance"/>.
    /// </summary>
    public Func<string, FloatTolerance?>? ColumnTolerance { get; init; }

    /// <summary>Most sample rows kept per finding.</summary>
    public int MaxSamples { get; init; } = 5;

    /// <summary>Tests: skip the typed fast pass and classify every row generically (the results must not change).</summary>
    internal bool GenericOnly { get; init; }

    /// <summary>The tolerance that applies to <paramref name="column"/>.</summary>
    public FloatTolerance ToleranceFor(string column) =>
        ColumnTolerance?.Invoke(column) ?? new FloatTolerance(FloatTolerance, RelativeTolerance);
}
