using Parity.Harness.Findings;

namespace Parity.Harness.Diffing;

/// <summary>The deterministic order of findings: line, checkpoint, kind, column, modes (ordinal, null first).</summary>
public sealed class FindingOrder : IComparer<Finding>
{
    public static FindingOrder Instance { get; } = new();

    public int Compare(Finding? x, Finding? y)
    {
        if (ReferenceEquals(x, y)) return 0;
        if (x is null) return -1;
        if (y is null) return 1;
        var c = x.Line.CompareTo(y.Line);
        if (c != 0) return c;
        c = string.CompareOrdinal(x.Checkpoint, y.Checkpoint);
        if (c != 0) return c;
        c = x.Kind.CompareTo(y.Kind);
        if (c != 0) return c;
        c = string.CompareOrdinal(x.Column, y.Column);
        if (c != 0) return c;
        c = string.CompareOrdinal(string.Join(",", x.Modes), string.Join(",", y.Modes));
        return c != 0 ? c : string.CompareOrdinal(x.Script, y.Script);
    }
}
