using System.Globalization;
using System.Text;
using Parity.Harness.Findings;
using Parity.Harness.Formatting;
using Parity.Harness.Golden.Internal;

namespace Parity.Harness.Golden;

/// <summary>Writes and reads a script's accepted findings file (docs/golden-format.md, "Accepted findings").</summary>
public static class GoldenFindingsText
{
    public const string Magic = "# parity golden findings 1";

    public static string Write(string script, IReadOnlyList<AcceptedFinding> findings)
    {
        var sb = new StringBuilder();
        sb.Append(Magic).Append('\n');
        sb.Append("script ").Append(CellText.Quote(script)).Append('\n');
        foreach (var f in findings)
        {
            sb.Append("finding ").Append(f.Kind)
              .Append(" count ").Append(f.Count.ToString(CultureInfo.InvariantCulture))
              .Append(" modes ").Append(string.Join(",", f.Modes))
              .Append(" line ").Append(f.Line.ToString(CultureInfo.InvariantCulture))
              .Append(" checkpoint ").Append(f.Checkpoint is null ? "-" : CellText.Quote(f.Checkpoint))
              .Append(" column ").Append(f.Column is null ? "-" : CellText.Quote(f.Column)).Append('\n');
            sb.Append("  message ").Append(CellText.Quote(f.Message)).Append('\n');
        }
        return sb.ToString();
    }

    public static AcceptedFinding FromFinding(Finding f) =>
        new(f.KindLabel, f.Line, f.Checkpoint, f.Column, f.Modes, f.Count, f.Message);

    public static (string Script, IReadOnlyList<AcceptedFinding> Findings) Read(string text, string file)
    {
        var cur = new LineCursor(text, file);
        cur.NextOrFail("the header line");
        if (!string.Equals(cur.Line, Magic, StringComparison.Ordinal)) throw cur.Fail("not a golden findings file: the first line must be '" + Magic + "'");
        cur.NextOrFail("script");
        cur.Expect("script");
        var script = cur.Quoted();
        cur.EndOfLine();
        var list = new List<AcceptedFinding>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        while (cur.Next())
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
            var f = new AcceptedFinding(kind, line, checkpoint, column, modes, count, message);
            if (!seen.Add(f.Identity)) throw cur.FailAt(0, "the finding above is listed twice");
            list.Add(f);
        }
        return (script, list);
    }

    private static bool IsKindLabel(string s)
    {
        foreach (var k in Enum.GetValues<FindingKind>())
            if (string.Equals(k.ToString().ToLowerInvariant(), s, StringComparison.Ordinal)) return true;
        return false;
    }
}
