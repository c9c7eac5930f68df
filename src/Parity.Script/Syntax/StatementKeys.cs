using System.Globalization;

namespace Parity.Script.Syntax;

/// <summary>
/// Names each statement of a script by its canonical text and its occurrence among statements with the
/// same text (<c>'set t.fare = 0' #2</c>), so a finding or golden record about a statement survives edits
/// elsewhere in the script: comments, blank lines, spacing and other statements (docs/workflow.md,
/// "Finding keys"). Line numbers are only for people.
/// </summary>
public sealed class StatementKeys
{
    private readonly List<(int First, int Last, string Key, Statement Statement)> _entries = [];

    public StatementKeys(IReadOnlyList<Statement> statements)
    {
        var seen = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var s in statements)
        {
            var occurrence = seen.GetValueOrDefault(s.Canonical) + 1;
            seen[s.Canonical] = occurrence;
            var first = s.Span.LineNumber;
            var last = Math.Max(first, s.LastLine + 1);
            _entries.Add((first, last, Format(s.Canonical, occurrence), s));
        }
    }

    /// <summary>The key form: the canonical text quoted as a script string, then <c>#</c> and the occurrence (1-based).</summary>
    public static string Format(string canonical, int occurrence) =>
        "'" + canonical.Replace("'", "''", StringComparison.Ordinal) + "' #" + occurrence.ToString(CultureInfo.InvariantCulture);

    /// <summary>Splits a key written by <see cref="Format"/> back into its canonical text and occurrence.</summary>
    public static bool TryParse(string key, out string canonical, out int occurrence)
    {
        canonical = "";
        occurrence = 0;
        var hash = key.LastIndexOf("' #", StringComparison.Ordinal);
        if (key.Length < 5 || key[0] != '\'' || hash < 1) return false;
        if (!int.TryParse(key.AsSpan(hash + 3), NumberStyles.None, CultureInfo.InvariantCulture, out occurrence) || occurrence < 1) return false;
        canonical = key[1..hash].Replace("''", "'", StringComparison.Ordinal);
        return true;
    }

    /// <summary>
    /// The key of the statement on 1-based <paramref name="line"/> (any of its lines when it continues over
    /// several); for a line no statement covers (runs built without statements) the text <c>line N</c>,
    /// which no statement has.
    /// </summary>
    public string KeyAt(int line)
    {
        var s = Find(line);
        return s is null ? Format("line " + line.ToString(CultureInfo.InvariantCulture), 1) : s.Value.Key;
    }

    /// <summary>The statement on 1-based <paramref name="line"/>, or null.</summary>
    public Statement? StatementAt(int line) => Find(line)?.Statement;

    private (int First, int Last, string Key, Statement Statement)? Find(int line)
    {
        foreach (var e in _entries)
            if (line >= e.First && line <= e.Last) return e;
        return null;
    }
}
