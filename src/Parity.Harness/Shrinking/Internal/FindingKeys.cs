using Parity.Harness.Findings;

namespace Parity.Harness.Shrinking.Internal;

/// <summary>
/// The one place that says which key names a finding for <c>parity shrink</c>: the <c>key</c> the JSON report
/// prints (<see cref="Finding.Key"/>, kind first, so a matching key means the same kind).
/// </summary>
internal static class FindingKeys
{
    public static string Of(Finding finding) => finding.Key;

    public static Finding? Find(IReadOnlyList<Finding> findings, string key)
    {
        foreach (var f in findings)
            if (string.Equals(Of(f), key, StringComparison.Ordinal)) return f;
        return null;
    }
}
