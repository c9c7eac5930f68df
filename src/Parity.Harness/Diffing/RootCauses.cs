using System.Globalization;
using Parity.Harness.Findings;

namespace Parity.Harness.Diffing;

/// <summary>
/// Shows one root cause once (docs/workflow.md, "One cause, one finding"):
/// <list type="bullet">
/// <item>a value or missing difference in a column that first appears at a checkpoint after a write into a
/// column of that name whose aliasing sets differ between the modes is tied to the latest such write before it
/// (<see cref="Finding.CausedBy"/>, the write's alias finding key) and says "after the write at line N".
/// Differences of missing markers alone (NaN against null) are never tied to a write: no write causes them.
/// Derivations are not traced, so a difference in a column of another name (a renamed copy, a computed
/// column) is not tied to the write;</item>
/// <item>a checkpoint difference that recurs at later checkpoints (same kind, column, difference and cause)
/// is one finding at the first checkpoint, with <see cref="Finding.AlsoAt"/> naming the later ones, the
/// total count, and each checkpoint's own count in <see cref="Finding.Occurrences"/>.</item>
/// </list>
/// </summary>
public static class RootCauses
{
    /// <summary>
    /// Groups <paramref name="findings"/> (one mode pair, in <see cref="FindingOrder"/>); <paramref name="aliasWrites"/>
    /// are the writes whose aliasing sets differ: their line and the column they write.
    /// </summary>
    public static IReadOnlyList<Finding> Group(IReadOnlyList<Finding> findings, IReadOnlyList<(int Line, string Column)> aliasWrites)
    {
        var aliasKeys = new Dictionary<int, string>();
        foreach (var f in findings)
            if (f.Kind == FindingKind.Alias) aliasKeys.TryAdd(f.Line, f.Key);
        var result = new List<Finding>(findings.Count);
        var groups = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var found in findings)
        {
            var f = found;
            if (f.Checkpoint is null)
            {
                result.Add(f);
                continue;
            }
            var cause = Causable(f) ? LatestBefore(aliasWrites, f.Line, f.Column) : -1;
            if (cause >= 0 && aliasKeys.TryGetValue(cause, out var causeKey))
            {
                f = f with
                {
                    CausedBy = causeKey,
                    CausedByLine = cause,
                    Message = f.Message + "; after the write at line " + cause.ToString(CultureInfo.InvariantCulture),
                };
            }
            var groupKey = f.KindLabel + "\u0001" + (f.Column ?? "\u0002") + "\u0001" + f.Difference + "\u0001" + string.Join(",", f.Modes) + "\u0001" + (f.CausedBy ?? "");
            if (!groups.TryGetValue(groupKey, out var at))
            {
                groups.Add(groupKey, result.Count);
                result.Add(f);
                continue;
            }
            var first = result[at];
            var alsoAt = new List<string>(first.AlsoAt) { f.Checkpoint };
            var occurrences = new List<FindingOccurrence>(first.Occurrences);
            occurrences.AddRange(f.Occurrences);
            result[at] = first with
            {
                Count = (int)Math.Min((long)first.Count + f.Count, int.MaxValue),
                AlsoAt = alsoAt,
                Occurrences = occurrences,
            };
        }
        return result;
    }

    /// <summary>Value differences, and missing differences where a value stands against a missing value (a write can cause those).</summary>
    private static bool Causable(Finding f) => f.Kind switch
    {
        FindingKind.Value => true,
        FindingKind.Missing => f.Difference.Contains("has a value", StringComparison.Ordinal)
            || f.Difference.Contains("a value in ", StringComparison.Ordinal)
            || f.Difference.Contains("'nan'", StringComparison.Ordinal),
        _ => false,
    };

    private static int LatestBefore(IReadOnlyList<(int Line, string Column)> writes, int line, string? column)
    {
        var best = -1;
        foreach (var (l, c) in writes)
            if (l < line && l > best && string.Equals(c, column, StringComparison.Ordinal)) best = l;
        return best;
    }
}
