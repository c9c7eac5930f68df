namespace Parity.Benchmarks.Quick;

/// <summary>
/// One ratio of the quick mode: two measured sides (numerator over denominator) and a target. Sides are
/// timed interleaved in one process, so machine noise hits both alike.
/// </summary>
public abstract class Ratio
{
    /// <summary>The name printed as <c>ratio NAME VALUE</c>.</summary>
    public abstract string Name { get; }

    public abstract double Target { get; }

    /// <summary>What the numerator and denominator are, for the table.</summary>
    public abstract string Description { get; }

    /// <summary>Builds the data once.</summary>
    public abstract void Setup();

    /// <summary>Runs the numerator side once.</summary>
    public abstract void Numerator();

    /// <summary>Runs the denominator side once.</summary>
    public abstract void Denominator();

    /// <summary>Checks both sides give the same result before timing; throws when they differ.</summary>
    public virtual void Verify()
    {
    }

    /// <summary>Repetitions of each side; heavier ratios use fewer.</summary>
    public virtual int Repetitions => 5;

    /// <summary>A ratio that is not a time (bytes): return it directly and skip timing.</summary>
    public virtual double? Direct => null;

    /// <summary>Releases the data.</summary>
    public virtual void Cleanup()
    {
    }
}
