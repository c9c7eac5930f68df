namespace Parity.Script.Checking;

/// <summary>
/// The functions and aggregates of the language (spec §3.4) with their argument counts. Names are matched
/// case-insensitively. The checker enforces the counts, so the interpreter may rely on them.
/// </summary>
public static class FunctionCatalog
{
    private static readonly Dictionary<string, (int Min, int Max, bool Aggregate)> Entries = new(StringComparer.OrdinalIgnoreCase)
    {
        ["length"] = (1, 1, false),
        ["upper"] = (1, 1, false),
        ["lower"] = (1, 1, false),
        ["trim"] = (1, 1, false),
        ["substring"] = (3, 3, false),
        ["replace"] = (3, 3, false),
        ["contains"] = (2, 2, false),
        ["starts_with"] = (2, 2, false),
        ["ends_with"] = (2, 2, false),
        ["text"] = (1, 1, false),
        ["coalesce"] = (1, int.MaxValue, false),
        ["abs"] = (1, 1, false),
        // round(x) means round(x, 0): half to even, like the two-argument form (spec §2.3).
        ["round"] = (1, 2, false),
        ["type_of"] = (1, 1, false),
        ["count"] = (0, 1, true),
        ["sum"] = (1, 1, true),
        ["avg"] = (1, 1, true),
        ["min"] = (1, 1, true),
        ["max"] = (1, 1, true),
        ["first"] = (1, 1, true),
        ["count_distinct"] = (1, 1, true),
    };

    /// <summary>Every function and aggregate name, lower case, in ordinal order.</summary>
    public static IReadOnlyList<string> Names { get; } = Entries.Keys.Order(StringComparer.Ordinal).ToArray();

    /// <summary>The aggregate names (allowed only in <c>group by ... compute</c>), lower case, in ordinal order.</summary>
    public static IReadOnlyList<string> AggregateNames { get; } =
        Entries.Where(e => e.Value.Aggregate).Select(e => e.Key).Order(StringComparer.Ordinal).ToArray();

    public static bool IsKnown(string name) => Entries.ContainsKey(name);

    public static bool IsAggregate(string name) => Entries.TryGetValue(name, out var e) && e.Aggregate;

    /// <summary>The accepted argument counts; <paramref name="max"/> is <see cref="int.MaxValue"/> for "or more".</summary>
    public static bool TryGetArity(string name, out int min, out int max)
    {
        if (Entries.TryGetValue(name, out var e))
        {
            min = e.Min;
            max = e.Max;
            return true;
        }
        min = max = 0;
        return false;
    }
}
