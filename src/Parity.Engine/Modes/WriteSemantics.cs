namespace Parity.Engine.Modes;

/// <summary>Whether derived frames may share storage with their parent (spec §2, axis "writes").</summary>
public enum WriteSemantics
{
    /// <summary>Row ranges and single-column picks are views that share storage both ways; everything else copies eagerly.</summary>
    Alias,

    /// <summary>Every derived frame behaves as an independent copy; storage is shared until the first write.</summary>
    Cow,
}
