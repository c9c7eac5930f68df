using System.Globalization;
using System.Text;
using Parity.Harness.Formatting;
using Parity.Harness.Golden.Internal;
using Parity.Script.Running;

namespace Parity.Harness.Golden;

/// <summary>Writes and reads a mode's golden run file (docs/golden-format.md, "Run files").</summary>
public static class GoldenRunText
{
    public const string Magic = "# parity golden run 1";

    public static string Write(ModeRun run)
    {
        var sb = new StringBuilder();
        sb.Append(Magic).Append('\n');
        sb.Append("mode ").Append(run.Mode.Name).Append('\n');
        foreach (var c in run.Checkpoints) sb.Append("checkpoint ").Append(CellText.Quote(c.Label)).Append('\n');
        foreach (var w in run.Writes)
        {
            sb.Append("write ").Append(Pos(w.Line, w.Column)).Append(' ').Append(CellText.Quote(w.Target)).Append(" changed");
            foreach (var f in Sorted(w.ChangedFrames)) sb.Append(' ').Append(CellText.Quote(f));
            sb.Append('\n');
        }
        foreach (var w in run.Warnings)
        {
            sb.Append("warning ").Append(Pos(w.Line, w.Column)).Append(' ').Append(w.Code).Append(" reached");
            foreach (var f in Sorted(w.ReachedFrames)) sb.Append(' ').Append(CellText.Quote(f));
            sb.Append(" message ").Append(CellText.Quote(w.Message)).Append('\n');
        }
        foreach (var n in run.Notes)
        {
            sb.Append("note ").Append(Pos(n.Line, n.Column)).Append(' ').Append(n.Kind).Append(' ')
              .Append(n.Count.ToString(CultureInfo.InvariantCulture)).Append(" message ").Append(CellText.Quote(n.Message)).Append('\n');
        }
        if (run.Failure is { } f2)
        {
            sb.Append("failure ").Append(Pos(f2.Span.LineNumber, f2.Span.ColumnNumber)).Append(' ').Append(f2.Code)
              .Append(" message ").Append(CellText.Quote(f2.Message)).Append('\n');
        }
        return sb.ToString();
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
        if (!string.Equals(cur.Line, Magic, StringComparison.Ordinal)) throw cur.Fail("not a golden run file: the first line must be '" + Magic + "'");
        cur.NextOrFail("mode");
        cur.Expect("mode");
        var mode = cur.Word();
        if (!Parity.Engine.Modes.Mode.TryParse(mode, out _)) throw cur.FailAt(5, "not a mode: " + CellText.Quote(mode));
        cur.EndOfLine();
        var checkpoints = new List<string>();
        var writes = new List<WriteRecord>();
        var warnings = new List<RunWarning>();
        var notes = new List<RunNote>();
        GoldenFailure? failure = null;
        while (cur.Next())
        {
            if (failure is not null) throw cur.Fail("nothing may follow the 'failure' line");
            cur.SkipSpaces();
            var at = cur.Position;
            var word = cur.Word();
            switch (word)
            {
                case "checkpoint":
                    checkpoints.Add(cur.Quoted());
                    break;
                case "write":
                {
                    var (line, col) = ReadPos(cur);
                    var target = cur.Quoted();
                    cur.Expect("changed");
                    writes.Add(new WriteRecord(line, col, target, ReadNames(cur, null)));
                    break;
                }
                case "warning":
                {
                    var (line, col) = ReadPos(cur);
                    var code = cur.Word();
                    cur.Expect("reached");
                    var reached = ReadNames(cur, "message");
                    cur.Expect("message");
                    warnings.Add(new RunWarning(code, line, col, cur.Quoted(), reached));
                    break;
                }
                case "note":
                {
                    var (line, col) = ReadPos(cur);
                    var kind = cur.Word();
                    var count = cur.Integer();
                    cur.Expect("message");
                    notes.Add(new RunNote(kind, line, col, count, cur.Quoted()));
                    break;
                }
                case "failure":
                {
                    var (line, col) = ReadPos(cur);
                    var code = cur.Word();
                    cur.Expect("message");
                    failure = new GoldenFailure(code, line, col, cur.Quoted());
                    break;
                }
                default:
                    throw cur.FailAt(at, "expected checkpoint, write, warning, note or failure");
            }
            cur.EndOfLine();
        }
        return new GoldenRun { Mode = mode, Checkpoints = checkpoints, Writes = writes, Warnings = warnings, Notes = notes, Failure = failure };
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
