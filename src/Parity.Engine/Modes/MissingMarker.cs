namespace Parity.Engine.Modes;

/// <summary>How a missing value is represented (spec §2, axis "missing").</summary>
public enum MissingMarker
{
    /// <summary>A floating-point NaN sentinel (a null reference in a boxed cell, NaT for timestamps); comparisons are false.</summary>
    Nan,

    /// <summary>One <c>null</c> marker for every type, with three-valued (Kleene) logic.</summary>
    Null,
}
