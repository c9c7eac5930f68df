namespace Parity.Script.Parsing;

/// <summary>
/// The reserved words of the language (spec §3). They are matched case-insensitively and cannot be used as
/// bare names; a frame or column with such a name is written in double quotes (<c>"order"</c>). Cast types,
/// load formats, option keys and function names are not reserved: they are recognised by position.
/// </summary>
public static class Keywords
{
    private static readonly HashSet<string> Reserved = new(StringComparer.OrdinalIgnoreCase)
    {
        "load", "from", "as", "with", "let", "set", "check",
        "where", "take", "skip", "column", "select", "rename", "to", "cast", "add", "fill", "drop", "missing",
        "order", "by", "asc", "desc", "group", "compute", "join", "on", "inner", "left", "append", "distinct",
        "and", "or", "not", "is", "null", "true", "false",
    };

    /// <summary>The words that start a derivation clause (spec §3.2), in the order the reference lists them.</summary>
    public static IReadOnlyList<string> ClauseWords { get; } =
        ["where", "take", "skip", "column", "select", "rename", "cast", "add", "fill", "drop", "order", "group", "join", "append", "distinct"];

    /// <summary>The words that start a statement (spec §3.1).</summary>
    public static IReadOnlyList<string> StatementWords { get; } = ["load", "let", "set", "check"];

    /// <summary>Every reserved word, lower case, in ordinal order.</summary>
    public static IReadOnlyList<string> All { get; } = Reserved.Order(StringComparer.Ordinal).ToArray();

    public static bool IsReserved(string word) => Reserved.Contains(word);

    public static bool IsReserved(ReadOnlySpan<char> word) => Reserved.GetAlternateLookup<ReadOnlySpan<char>>().Contains(word);
}
