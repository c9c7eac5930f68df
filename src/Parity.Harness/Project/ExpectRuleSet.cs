using Parity.Harness.Findings;

namespace Parity.Harness.Project;

/// <summary>
/// The expect rules of one run: marks matching findings <see cref="FindingStatus.Expected"/> and counts what
/// each rule matched over every script of the run, so a rule that matched nothing can be reported (it may be
/// stale). Safe to use from several scripts at once.
/// </summary>
public sealed class ExpectRuleSet
{
    private readonly IReadOnlyList<ExpectRule> _rules;
    private readonly int[] _hits;

    public ExpectRuleSet(IReadOnlyList<ExpectRule> rules)
    {
        _rules = rules;
        _hits = new int[rules.Count];
    }

    public static ExpectRuleSet Empty { get; } = new([]);

    public IReadOnlyList<ExpectRule> Rules => _rules;

    /// <summary>
    /// The findings with every match of a rule marked expected (every rule that matches counts it). Resolved
    /// findings are left alone: they are gone from the run. An accepted or changed finding that a rule matches
    /// becomes expected too: the rule states the team's decision for the whole class.
    /// </summary>
    public IReadOnlyList<Finding> Apply(IReadOnlyList<Finding> findings)
    {
        if (_rules.Count == 0) return findings;
        var result = new List<Finding>(findings.Count);
        foreach (var f in findings)
        {
            var marked = f;
            if (f.Status != FindingStatus.Resolved)
            {
                for (var i = 0; i < _rules.Count; i++)
                {
                    if (!_rules[i].Matches(f)) continue;
                    Interlocked.Increment(ref _hits[i]);
                    if (marked.Status != FindingStatus.Expected) marked = f with { Status = FindingStatus.Expected };
                }
            }
            result.Add(marked);
        }
        return result;
    }

    /// <summary>How many findings rule <paramref name="index"/> marked so far.</summary>
    public int Hits(int index) => Volatile.Read(ref _hits[index]);

    /// <summary>The rules that matched no finding, in file order.</summary>
    public IReadOnlyList<ExpectRule> Unmatched()
    {
        var list = new List<ExpectRule>();
        for (var i = 0; i < _rules.Count; i++)
            if (Hits(i) == 0) list.Add(_rules[i]);
        return list;
    }
}
