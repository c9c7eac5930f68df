namespace Parity.Engine.Values;

/// <summary>Which missing marker a cell holds; reports and golden files keep them apart.</summary>
public enum MissingKind : byte
{
    /// <summary>Not missing.</summary>
    None = 0,

    /// <summary>A floating-point NaN sentinel (<c>nan</c> modes).</summary>
    NaN,

    /// <summary>A null reference in a boxed cell under <c>nan</c> modes; printed <c>None</c>.</summary>
    NoneRef,

    /// <summary>The one <c>null</c> marker of <c>null</c> modes.</summary>
    Null,

    /// <summary>A missing timestamp under <c>nan</c> modes ("not a time").</summary>
    NaT,
}
