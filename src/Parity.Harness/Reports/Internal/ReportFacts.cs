using System.Globalization;
using Parity.Harness.Findings;

namespace Parity.Harness.Reports.Internal;

/// <summary>Counts and labels every report format shares, so they never disagree.</summary>
internal static class ReportFacts
{
    public static IReadOnlyList<FindingKind> Kinds { get; } =
        [FindingKind.Shape, FindingKind.Type, FindingKind.Value, FindingKind.Missing, FindingKind.Alias, FindingKind.Warning, FindingKind.Error];

    public static string Label(FindingKind kind) => kind.ToString().ToLowerInvariant();

    public static string Label(FindingStatus status) => status.ToString().ToLowerInvariant();

    public static string Status(ScriptResult script) => script.Failed ? "failed" : "passed";

    public static string Status(GateReport report) => report.Failed ? "failed" : "passed";

    /// <summary>Findings per kind, counting groups (not rows) and leaving resolved findings out.</summary>
    public static int[] CountByKind(ScriptResult script)
    {
        var counts = new int[Kinds.Count];
        foreach (var f in script.Findings)
            if (f.Status != FindingStatus.Resolved) counts[(int)f.Kind]++;
        return counts;
    }

    public static int[] CountByKind(GateReport report)
    {
        var counts = new int[Kinds.Count];
        foreach (var s in report.Scripts)
        {
            var c = CountByKind(s);
            for (var i = 0; i < counts.Length; i++) counts[i] += c[i];
        }
        return counts;
    }

    public static int CountByStatus(ScriptResult script, FindingStatus status)
    {
        var n = 0;
        foreach (var f in script.Findings)
            if (f.Status == status) n++;
        return n;
    }

    /// <summary>"checkpoint 'x'" or "line 7": where a finding stands, without escaping.</summary>
    public static string Where(Finding f) =>
        f.Checkpoint is null ? "line " + Int(f.Line) : "checkpoint '" + f.Checkpoint + "' (line " + Int(f.Line) + ")";

    /// <summary>The later checkpoints of a grouped finding with their counts: <c>'refunds' x2, 'tail' x34</c>.</summary>
    public static string AlsoAtText(Finding f)
    {
        var parts = new List<string>(f.AlsoAt.Count);
        if (f.Occurrences.Count == f.AlsoAt.Count + 1)
            for (var i = 1; i < f.Occurrences.Count; i++) parts.Add("'" + f.Occurrences[i].Checkpoint + "' x" + Int(f.Occurrences[i].Count));
        else
            foreach (var a in f.AlsoAt) parts.Add("'" + a + "'");
        return string.Join(", ", parts);
    }

    /// <summary>"after the write at line 8 (statement 'set t.fare = 0' #1)" for a finding with a cause, else null.</summary>
    public static string? CauseText(Finding f) =>
        f.CausedBy is null ? null : "the write at line " + (f.CausedByLine is { } l ? Int(l) : "?");

    public static string Int(long n) => n.ToString(CultureInfo.InvariantCulture);

    /// <summary>The value of a sample for a mode position; a missing entry is shown as empty.</summary>
    public static string SampleValue(FindingSample sample, int modeIndex) =>
        modeIndex < sample.Values.Count ? sample.Values[modeIndex] : "";

    public static string Row(FindingSample sample) => sample.Row is { } r ? Int(r) : "";

    /// <summary>The counts as "2 value, 1 type" in kind order, or "none".</summary>
    public static string KindSummary(int[] counts)
    {
        var parts = new List<string>();
        for (var i = 0; i < counts.Length; i++)
            if (counts[i] > 0) parts.Add(Int(counts[i]) + " " + Label(Kinds[i]));
        return parts.Count == 0 ? "none" : string.Join(", ", parts);
    }
}
