namespace Parity.Harness.Findings;

/// <summary>
/// What one reason of a finding turns into what, from the first mode of the pair to the second: type labels
/// for <c>type</c> findings (<c>object</c> to <c>utf8</c>), missing markers for <c>missing</c> findings
/// (<c>NaN</c>, <c>None</c>, <c>null</c>, <c>NaT</c>, the text <c>'nan'</c>, or <c>value</c>). Expect rules
/// match on it (docs/workflow.md, "Expected differences").
/// </summary>
public sealed record FindingDifference(string From, string To);
