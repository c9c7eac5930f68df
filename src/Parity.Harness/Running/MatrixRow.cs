using Parity.Harness.Findings;

namespace Parity.Harness.Running;

/// <summary>
/// One legacy-vs-modern finding of <c>parity matrix</c>: how many of the four mode pairs that differ in one
/// axis only show it (per axis, in the order of <see cref="AxisMatrix.Axes"/>), and its causes: the minimal
/// sets of axes whose flip alone, starting from <c>legacy</c>, reproduces it (<c>[["writes"]]</c>;
/// <c>[["strings"], ["missing"]]</c> when either flip does; <c>[["strings", "missing"]]</c> when only both do).
/// </summary>
public sealed record MatrixRow(Finding Finding, IReadOnlyList<int> PairsPerAxis, IReadOnlyList<IReadOnlyList<string>> Causes);
