using Parity.Harness.Running;

namespace Parity.Harness.Gate;

/// <summary>
/// One script's axis matrix: each <c>legacy</c>-against-<c>modern</c> finding (status marked against the
/// accepted set) with, per axis (strings, missing, writes), how many of the four mode pairs that differ in
/// that axis only show it, and its causes (<see cref="MatrixRow"/>).
/// </summary>
/// <param name="Script">The script path relative to the working directory, forward slashes.</param>
/// <param name="Rows">The findings in report order.</param>
public sealed record MatrixScript(string Script, IReadOnlyList<MatrixRow> Rows)
{
    /// <summary>True when a finding is neither accepted nor expected (new or changed): <c>matrix</c> exits 1.</summary>
    public bool Failed
    {
        get
        {
            foreach (var r in Rows)
                if (r.Finding.Status is Findings.FindingStatus.New or Findings.FindingStatus.Changed) return true;
            return false;
        }
    }
}
