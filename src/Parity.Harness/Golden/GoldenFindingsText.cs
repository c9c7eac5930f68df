using System.Globalization;
using System.Text;
using Parity.Harness.Findings;
using Parity.Harness.Formatting;
using Parity.Harness.Golden.Internal;

namespace Parity.Harness.Golden;

/// <summary>
/// Writes and reads a script's accepted findings file (docs/golden-format.md, "Accepted findings"). Version 2
/// keys findings without line numbers; version 1 files (keyed by line) still load, and the next accept
/// writes version 2.
/// </summary>
public static class GoldenFindingsText
{
    public const int CurrentVersion = 2;
    public const string Magic = "# parity golden findings 2";
    public const string MagicVersion1 = "# parity golden findings 1";

    public static string Write(string script, IReadOnlyList<AcceptedFinding> findings)
    {
        var sb = new StringBuilder();
        sb.Append(Magic).Append('\n');
        sb.Append("script ").Append(CellText.Quote(script)).Append('\n');
        foreach (var f in findings)
        {
            sb.Append("finding ").Append(f.Kind)
              .Append(" count ").Append(f.Count.ToString(CultureInfo.InvariantCulture))
              .Append(" modes ").Append(string.Join(",", f.Modes));
            if (f.Checkpoint is not null) sb.Append(" checkpoint ").Append(CellText.Quote(f.Checkpoint));
            else
            {
                if (!Parity.Script.Syntax.StatementKeys.TryParse(f.Statement ?? "", out var text, out var occurrence))
                    (text, occurrence) = ("line " + f.Line.ToString(CultureInfo.InvariantCulture), 1);
                sb.Append(" statement ").Append(CellText.Quote(text)).Append(" #").Append(occurrence.ToString(CultureInfo.InvariantCulture));
            }
            sb.Append(" column ").Append(f.Column is null ? "-" : CellText.Quote(f.Column)).Append('\n');
            sb.Append("  difference ").Append(CellText.Quote(f.Difference)).Append('\n');
            if (f.AlsoAt.Count > 0)
            {
                sb.Append("  also_at");
                foreach (var a in f.AlsoAt) sb.Append(' ').Append(CellText.Quote(a));
                sb.Append('\n');
            }
            if (f.CausedBy is not null) sb.Append("  caused_by ").Append(CellText.Quote(f.CausedBy)).Append('\n');
            sb.Append("  line ").Append(f.Line.ToString(CultureInfo.InvariantCulture)).Append('\n');
            sb.Append("  message ").Append(CellText.Quote(f.Message)).Append('\n');
        }
        return sb.ToString();
    }

    public static AcceptedFinding FromFinding(Finding f) =>
        new(f.KindLabel, f.Line, f.Checkpoint, f.Column, f.Modes, f.Count, f.Message)
        {
            Statement = f.Checkpoint is null ? f.Statement : null,
            Difference = f.Difference,
            AlsoAt = f.AlsoAt,
            CausedBy = f.CausedBy,
        };

    public static (string Script, IReadOnlyList<AcceptedFinding> Findings) Read(string text, string file)
    {
        var cur = new LineCursor(text, file);
        cur.NextOrFail("the header line");
        var version = string.Equals(cur.Line, Magic, StringComparison.Ordinal) ? 2
            : string.Equals(cur.Line, MagicVersion1, StringComparison.Ordinal) ? 1
            : throw cur.Fail("not a golden findings file: the first line must be '" + Magic + "'");
        cur.NextOrFail("script");
        cur.Expect("script");
        var script = cur.Quoted();
        cur.EndOfLine();
        var list = new List<AcceptedFinding>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var more = cur.Next();
        while (more)
        {
            var startLine = cur.LineNumber;
            var f = version == 1 ? ReadVersion1(cur) : ReadVersion2(cur, out more);
            if (version == 1) more = cur.Next();
            if (!seen.Add(f.Identity)) throw new Parity.Engine.Errors.EngineException(Parity.Engine.Errors.ErrorCodes.Golden, "this finding is listed twice", file, startLine, 1);
            list.Add(f);
        }
        return (script, list);
    }

    private static (string Kind, int Count, string[] Modes) ReadHead(LineCursor cur)
    {
        cur.Expect("finding");
        cur.SkipSpaces();
        var kindAt = cur.Position;
        var kind = cur.Word();
        if (!IsKindLabel(kind))
            throw cur.FailAt(kindAt, "not a finding kind: " + CellText.Quote(kind) + " (shape, type, value, missing, alias, warning, error)");
        cur.Expect("count");
        var count = (int)cur.Integer(0, int.MaxValue);
        cur.Expect("modes");
        cur.SkipSpaces();
        var modesAt = cur.Position;
        var modes = cur.Word().Split(',');
        foreach (var m in modes)
            if (!Parity.Engine.Modes.Mode.TryParse(m, out _)) throw cur.FailAt(modesAt, "not a mode: " + CellText.Quote(m));
        return (kind, count, modes);
    }

    private static AcceptedFinding ReadVersion1(LineCursor cur)
    {
        var (kind, count, modes) = ReadHead(cur);
        cur.Expect("line");
        var line = (int)cur.Integer(0, int.MaxValue);
        cur.Expect("checkpoint");
        var checkpoint = cur.QuotedOrDash();
        cur.Expect("column");
        var column = cur.QuotedOrDash();
        cur.EndOfLine();
        cur.NextOrFail("the finding's message line");
        cur.Expect("message");
        var message = cur.Quoted();
        cur.EndOfLine();
        return new AcceptedFinding(kind, line, checkpoint, column, modes, count, message) { Version = 1 };
    }

    /// <summary>Reads one finding block; <paramref name="more"/> tells whether the cursor stands on the next block.</summary>
    private static AcceptedFinding ReadVersion2(LineCursor cur, out bool more)
    {
        var (kind, count, modes) = ReadHead(cur);
        cur.SkipSpaces();
        var placeAt = cur.Position;
        var place = cur.Word();
        string? checkpoint = null, statement = null;
        if (place == "checkpoint") checkpoint = cur.Quoted();
        else if (place == "statement") statement = ReadStatementKey(cur);
        else throw cur.FailAt(placeAt, "expected 'checkpoint' or 'statement'");
        cur.Expect("column");
        var column = cur.QuotedOrDash();
        cur.EndOfLine();
        cur.NextOrFail("the finding's difference line");
        cur.Expect("difference");
        var difference = cur.Quoted();
        cur.EndOfLine();
        var alsoAt = new List<string>();
        string? causedBy = null;
        var line = 0;
        cur.NextOrFail("the finding's line or message");
        if (cur.PeekWord() == "also_at")
        {
            cur.Expect("also_at");
            while (true)
            {
                cur.SkipSpaces();
                if (cur.AtEndOfLine) break;
                alsoAt.Add(cur.Quoted());
            }
            cur.NextOrFail("the finding's line or message");
        }
        if (cur.PeekWord() == "caused_by")
        {
            cur.Expect("caused_by");
            causedBy = cur.Quoted();
            cur.EndOfLine();
            cur.NextOrFail("the finding's line");
        }
        cur.Expect("line");
        line = (int)cur.Integer(0, int.MaxValue);
        cur.EndOfLine();
        cur.NextOrFail("the finding's message line");
        cur.Expect("message");
        var message = cur.Quoted();
        cur.EndOfLine();
        more = cur.Next();
        return new AcceptedFinding(kind, line, checkpoint, column, modes, count, message)
        {
            Statement = statement,
            Difference = difference,
            AlsoAt = alsoAt,
            CausedBy = causedBy,
        };
    }

    /// <summary>A statement as the file holds it: its canonical text (a quoted string), then <c>#N</c>, its occurrence.</summary>
    private static string ReadStatementKey(LineCursor cur)
    {
        var text = cur.Quoted();
        cur.SkipSpaces();
        var occAt = cur.Position;
        var occ = cur.Word();
        if (occ.Length < 2 || occ[0] != '#' || !int.TryParse(occ.AsSpan(1), NumberStyles.None, CultureInfo.InvariantCulture, out var n) || n < 1)
            throw cur.FailAt(occAt, "expected '#N' (the statement's occurrence, 1 or more)");
        return Parity.Script.Syntax.StatementKeys.Format(text, n);
    }

    private static bool IsKindLabel(string s)
    {
        foreach (var k in Enum.GetValues<FindingKind>())
            if (string.Equals(k.ToString().ToLowerInvariant(), s, StringComparison.Ordinal)) return true;
        return false;
    }
}
