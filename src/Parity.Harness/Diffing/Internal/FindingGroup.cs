using System.Globalization;
using Parity.Harness.Findings;

namespace Parity.Harness.Diffing.Internal;

/// <summary>
/// Collects the differences of one (checkpoint or line, column, kind): a total count, counts per reason
/// (the message lists them in first-seen order), the first samples, and the hint of the strongest reason.
/// </summary>
internal sealed class FindingGroup
{
    private readonly List<(string Reason, long Count)> _reasons = [];
    private readonly SortedSet<string> _differences = new(StringComparer.Ordinal);
    private readonly List<FindingSample> _samples = [];
    private readonly List<FindingDifference> _fromTo = [];
    private readonly int _maxSamples;
    private int _hintRank = -1;

    public FindingGroup(FindingKind kind, int line, string? checkpoint, string? column, int maxSamples)
    {
        Kind = kind;
        Line = line;
        Checkpoint = checkpoint;
        Column = column;
        _maxSamples = maxSamples;
    }

    public FindingKind Kind { get; }

    public int Line { get; }

    public string? Checkpoint { get; }

    public string? Column { get; }

    public long Count { get; private set; }

    public string Hint { get; private set; } = "";

    /// <summary>
    /// Adds <paramref name="count"/> differences for <paramref name="reason"/>; the highest <paramref name="rank"/>
    /// picks the hint. <paramref name="difference"/> is the reason without counts or rows (part of the key).
    /// </summary>
    public void Add(string reason, long count, string hint, int rank, string difference)
    {
        Count += count;
        _differences.Add(difference);
        var found = false;
        for (var i = 0; i < _reasons.Count; i++)
        {
            if (!string.Equals(_reasons[i].Reason, reason, StringComparison.Ordinal)) continue;
            _reasons[i] = (reason, _reasons[i].Count + count);
            found = true;
            break;
        }
        if (!found) _reasons.Add((reason, count));
        if (rank > _hintRank)
        {
            _hintRank = rank;
            Hint = hint;
        }
    }

    /// <summary>Records what the reason turns into what (type labels, missing markers), once per distinct pair.</summary>
    public void FromTo(string from, string to)
    {
        foreach (var d in _fromTo)
            if (string.Equals(d.From, from, StringComparison.Ordinal) && string.Equals(d.To, to, StringComparison.Ordinal)) return;
        _fromTo.Add(new FindingDifference(from, to));
    }

    public bool WantsSample => _samples.Count < _maxSamples;

    public void Sample(int? row, params string[] values)
    {
        if (_samples.Count < _maxSamples) _samples.Add(new FindingSample(row, values));
    }

    /// <summary>The differences seen, sorted ordinally and joined by <c>; </c>.</summary>
    public string Difference => string.Join("; ", _differences);

    public Finding ToFinding(string script, IReadOnlyList<string> modes, bool countReasons, string? statement)
    {
        var parts = new List<string>(_reasons.Count);
        foreach (var (reason, count) in _reasons)
            parts.Add(countReasons && _reasons.Count > 1 ? reason + " (" + count.ToString(CultureInfo.InvariantCulture) + ")" : reason);
        return new Finding
        {
            Kind = Kind,
            Script = script,
            Line = Line,
            Checkpoint = Checkpoint,
            Statement = Checkpoint is null ? statement : null,
            Column = Column,
            Difference = Difference,
            Count = (int)Math.Min(Count, int.MaxValue),
            Message = string.Join("; ", parts),
            Hint = Hint,
            Modes = modes,
            Samples = _samples.ToArray(),
            Occurrences = Checkpoint is null ? [] : [new FindingOccurrence(Checkpoint, Line, (int)Math.Min(Count, int.MaxValue))],
            FromTo = _fromTo.ToArray(),
        };
    }
}
