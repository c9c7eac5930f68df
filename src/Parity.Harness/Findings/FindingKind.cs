namespace Parity.Harness.Findings;

/// <summary>Finding kinds of spec §5; the JSON and golden label is the lower-case name.</summary>
public enum FindingKind
{
    Shape,
    Type,
    Value,
    Missing,
    Alias,
    Warning,
    Error,
}
