using Parity.Harness.Findings;

namespace Parity.Harness.Gate;

/// <summary>
/// One script's axis matrix: each <c>legacy</c>-against-<c>modern</c> finding with, per axis (strings,
/// missing, writes), how many of the four mode pairs that differ in that axis only show it.
/// </summary>
/// <param name="Script">The script path relative to the working directory, forward slashes.</param>
/// <param name="Rows">The findings in report order, each with its three per-axis pair counts.</param>
public sealed record MatrixScript(string Script, IReadOnlyList<(Finding Finding, int[] PairsPerAxis)> Rows);
