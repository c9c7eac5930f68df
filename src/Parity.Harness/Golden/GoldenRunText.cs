using System.Globalization;
using System.Text;
using Parity.Harness.Formatting;
using Parity.Harness.Golden.Internal;
using Parity.Script.Running;
using Parity.Script.Syntax;

namespace Parity.Harness.Golden;

/// <summary>
/// Writes and reads a mode's golden run file (docs/golden-format.md, "Run files"). Version 2 names each
/// record's statement by its canonical text and occurrence (the position after <c>at</c> is for people);
/// version 1 files, which named statements by position only, still load.
/// </summary>
public static class GoldenRunText
{
    public const int CurrentVersion = 2;
    public const string Magic = "# parity golden run 2";
    public const string MagicVersion1 = "# parity golden run 1";

    public static string Write(ModeRun run)
    {
        var keys = new StatementKeys(run.Statements);
        var sb = new StringBuilder();
        sb.Append(Magic).Append('\n');
        sb.Append("mode ").Append(run.Mode.Name).Append('\n');
        foreach (var c in run.Checkpoints) sb.Append("checkpoint ").Append(CellText.Quote(c.Label)).Append('\n');
        foreach (var w in run.Writes)
        {
            sb.Append("write ").Append(Statement(keys, w.Line)).Append(" at ").Append(Pos(w.Line, w.Column)).Append(' ').Append(CellText.Quote(w.Target)).Append(" changed");
            foreach (var f in Sorted(w.ChangedFrames)) sb.Append(' ').Append(CellText.Quote(f));
            sb.Append('\n');
        }
        foreach (var w in run.Warnings)
        {
            sb.Append("warning ").Append(Statement(keys, w.Line)).Append(" at ").Append(Pos(w.Line, w.Column)).Append(' ').Append(w.Code).Append(" reached");
            foreach (var f in Sorted(w.ReachedFrames)) sb.Append(' ').Append(CellText.Quote(f));
            sb.Append(" message ").Append(CellText.Quote(w.Message)).Append('\n');
        }
        foreach (var n in run.Notes)
        {
            sb.Append("note ").Append(Statement(keys, n.Line)).Append(" at ").Append(Pos(n.Line, n.Column)).Append(' ').Append(n.Kind).Append(' ')
              .Append(n.Count.ToString(CultureInfo.InvariantCulture)).Append(" message ").Append(CellText.Quote(n.Message)).Append('\n');
        }
        if (run.Failure is { } f2)
        {
            sb.Append("failure ").Append(Statement(keys, f2.Span.LineNumber)).Append(" at ").Append(Pos(f2.Span.LineNumber, f2.Span.ColumnNumber)).Append(' ').Append(f2.Code)
              .Append(" message ").Append(CellText.Quote(f2.Message)).Append('\n');
        }
        return sb.ToString();
    }

    /// <summary>The records of a current run, keyed as a version 2 file keys them.</summary>
    public static IReadOnlyList<GoldenRecord> Records(ModeRun run)
    {
        var keys = new StatementKeys(run.Statements);
        var list = new List<GoldenRecord>();
        foreach (var w in run.Writes) list.Add(WriteRecordOf(keys.KeyAt(w.Line), w.Line, w.Target, w.ChangedFrames));
        foreach (var w in run.Warnings) list.Add(WarningRecordOf(keys.KeyAt(w.Line), w.Line, w.Code, w.ReachedFrames, w.Message));
        foreach (var n in run.Notes) list.Add(NoteRecordOf(keys.KeyAt(n.Line), n.Line, n.Kind, n.Count, n.Message));
        if (run.Failure is { } f) list.Add(FailureRecordOf(keys.KeyAt(f.Span.LineNumber), f.Span.LineNumber, f.Code, f.Message));
        return list;
    }

    private static GoldenRecord WriteRecordOf(string? key, int line, string target, IReadOnlyList<string> changed) =>
        new("write", key, line, "", "to " + CellText.Quote(target) + " changed " + Set(changed));

    private static GoldenRecord WarningRecordOf(string? key, int line, string code, IReadOnlyList<string> reached, string message) =>
        new("warning", key, line, code, "reached " + Set(reached) + ": " + CellText.Quote(message));

    private static GoldenRecord NoteRecordOf(string? key, int line, string kind, long count, string message) =>
        new("note", key, line, kind, count.ToString(CultureInfo.InvariantCulture) + " rows: " + CellText.Quote(message));

    private static GoldenRecord FailureRecordOf(string? key, int line, string code, string message) =>
        new("failure", key, line, "", code + ": " + CellText.Quote(message));

    private static string Set(IReadOnlyList<string> names)
    {
        var sorted = Sorted(names);
        var quoted = new string[sorted.Count];
        for (var i = 0; i < quoted.Length; i++) quoted[i] = CellText.Quote(sorted[i]);
        return "{" + string.Join(", ", quoted) + "}";
    }

    private static string Statement(StatementKeys keys, int line)
    {
        StatementKeys.TryParse(keys.KeyAt(line), out var text, out var occurrence);
        return CellText.Quote(text) + " #" + occurrence.ToString(CultureInfo.InvariantCulture);
    }

    private static string Pos(int line, int col) =>
        line.ToString(CultureInfo.InvariantCulture) + ":" + col.ToString(CultureInfo.InvariantCulture);

    private static List<string> Sorted(IReadOnlyList<string> names)
    {
        var l = new List<string>(names);
        l.Sort(StringComparer.Ordinal);
        return l;
    }

    public static GoldenRun Read(string text, string file)
    {
        var cur = new LineCursor(text, file);
        cur.NextOrFail("the header line");
        var version = string.Equals(cur.Line, Magic, StringComparison.Ordinal) ? 2
            : string.Equals(cur.Line, MagicVersion1, StringComparison.Ordinal) ? 1
            : throw cur.Fail("not a golden run file: the first line must be '" + Magic + "'");
        cur.NextOrFail("mode");
        cur.Expect("mode");
        var mode = cur.Word();
        if (!Parity.Engine.Modes.Mode.TryParse(mode, out _)) throw cur.FailAt(5, "not a mode: " + CellText.Quote(mode));
        cur.EndOfLine();
        var checkpoints = new List<string>();
        var writes = new List<WriteRecord>();
        var warnings = new List<RunWarning>();
        var notes = new List<RunNote>();
        var records = new List<GoldenRecord>();
        GoldenFailure? failure = null;
        while (cur.Next())
        {
            if (failure is not null) throw cur.Fail("nothing may follow the 'failure' line");
            cur.SkipSpaces();
            var at = cur.Position;
            var word = cur.Word();
            if (word is "write" or "warning" or "note" or "failure") { }
            else if (word == "checkpoint")
            {
                checkpoints.Add(cur.Quoted());
                cur.EndOfLine();
                continue;
            }
            else throw cur.FailAt(at, "expected checkpoint, write, warning, note or failure");
            string? key = null;
            if (version >= 2)
            {
                key = ReadStatement(cur);
                cur.Expect("at");
            }
            var (line, col) = ReadPos(cur);
            switch (word)
            {
                case "write":
                {
                    var target = cur.Quoted();
                    cur.Expect("changed");
                    var w = new WriteRecord(line, col, target, ReadNames(cur, null));
                    writes.Add(w);
                    records.Add(WriteRecordOf(key, line, w.Target, w.ChangedFrames));
                    break;
                }
                case "warning":
                {
                    var code = cur.Word();
                    cur.Expect("reached");
                    var reached = ReadNames(cur, "message");
                    cur.Expect("message");
                    var w = new RunWarning(code, line, col, cur.Quoted(), reached);
                    warnings.Add(w);
                    records.Add(WarningRecordOf(key, line, w.Code, w.ReachedFrames, w.Message));
                    break;
                }
                case "note":
                {
                    var kind = cur.Word();
                    var count = cur.Integer();
                    cur.Expect("message");
                    var n = new RunNote(kind, line, col, count, cur.Quoted());
                    notes.Add(n);
                    records.Add(NoteRecordOf(key, line, n.Kind, n.Count, n.Message));
                    break;
                }
                default:
                {
                    var code = cur.Word();
                    cur.Expect("message");
                    failure = new GoldenFailure(code, line, col, cur.Quoted());
                    records.Add(FailureRecordOf(key, line, failure.Code, failure.Message));
                    break;
                }
            }
            cur.EndOfLine();
        }
        return new GoldenRun { Mode = mode, Checkpoints = checkpoints, Writes = writes, Warnings = warnings, Notes = notes, Failure = failure, Records = records, Version = version };
    }

    private static string ReadStatement(LineCursor cur)
    {
        var text = cur.Quoted();
        cur.SkipSpaces();
        var at = cur.Position;
        var occ = cur.Word();
        if (occ.Length < 2 || occ[0] != '#' || !int.TryParse(occ.AsSpan(1), NumberStyles.None, CultureInfo.InvariantCulture, out var n) || n < 1)
            throw cur.FailAt(at, "expected '#N' (the statement's occurrence, 1 or more)");
        return StatementKeys.Format(text, n);
    }

    private static (int Line, int Column) ReadPos(LineCursor cur)
    {
        cur.SkipSpaces();
        var at = cur.Position;
        var w = cur.Word();
        var colon = w.IndexOf(':', StringComparison.Ordinal);
        if (colon > 0
            && int.TryParse(w.AsSpan(0, colon), NumberStyles.None, CultureInfo.InvariantCulture, out var line)
            && int.TryParse(w.AsSpan(colon + 1), NumberStyles.None, CultureInfo.InvariantCulture, out var col))
            return (line, col);
        throw cur.FailAt(at, "expected LINE:COLUMN");
    }

    private static List<string> ReadNames(LineCursor cur, string? stopWord)
    {
        var names = new List<string>();
        while (true)
        {
            cur.SkipSpaces();
            if (cur.AtEndOfLine) break;
            if (stopWord is not null && string.Equals(cur.PeekWord(), stopWord, StringComparison.Ordinal)) break;
            names.Add(cur.Quoted());
        }
        return names;
    }
}
