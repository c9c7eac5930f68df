using Parity.Script.Syntax;

namespace Parity.Script.Running.Internal;

/// <summary>
/// Where each frame name is mentioned for the last time, so a run can let go of frames no later statement
/// reads: on a 20-million-row input every named intermediate frame is gigabytes, and a script that derives
/// step by step would otherwise hold all of them to the end.
/// </summary>
internal static class FrameLifetimes
{
    /// <summary>
    /// For each statement, the names it mentions (binds, reads, writes, checks, joins or appends) that no
    /// later statement mentions.
    /// </summary>
    public static List<string>[] LastMentions(IReadOnlyList<Statement> statements)
    {
        var last = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < statements.Count; i++)
            foreach (var name in Mentions(statements[i]))
                last[name] = i;
        var result = new List<string>[statements.Count];
        for (var i = 0; i < result.Length; i++) result[i] = [];
        foreach (var (name, index) in last) result[index].Add(name);
        foreach (var list in result) list.Sort(StringComparer.Ordinal);
        return result;
    }

    private static IEnumerable<string> Mentions(Statement statement)
    {
        switch (statement)
        {
            case LoadStatement load:
                yield return load.Name.Name;
                break;
            case LetStatement let:
                yield return let.Name.Name;
                foreach (var name in Mentions(let.Value)) yield return name;
                break;
            case SetStatement set:
                if (set.Frame is { } frame) yield return frame.Name;
                if (set.Chain is { } chain)
                    foreach (var name in Mentions(chain)) yield return name;
                break;
            case CheckStatement check:
                yield return check.Frame.Name;
                break;
        }
    }

    private static IEnumerable<string> Mentions(Derivation derivation)
    {
        yield return derivation.Source.Name;
        foreach (var clause in derivation.Clauses)
        {
            if (clause is JoinClause join) yield return join.Other.Name;
            else if (clause is AppendClause append) yield return append.Other.Name;
        }
    }
}
