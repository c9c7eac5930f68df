using System.Globalization;
using System.Text;
using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Harness.Formatting;
using Parity.Script.Running;

namespace Parity.Harness.Running;

/// <summary>
/// <c>parity matrix</c>: for each finding between legacy and modern, which single axis flip (strings,
/// missing, writes) causes it. All eight modes run; for each axis the four pairs of modes that differ in
/// that axis only are diffed, and a finding counts for the axis in each pair that shows a finding with the
/// same kind, place and column.
/// </summary>
public static class AxisMatrix
{
    public static IReadOnlyList<string> Axes { get; } = ["strings", "missing", "writes"];

    /// <summary>The table: one row per legacy-vs-modern finding with, per axis, how many of its four pairs show it.</summary>
    public static IReadOnlyList<(Finding Finding, int[] PairsPerAxis)> Build(IReadOnlyList<ModeRun> allEight, string script, DiffOptions options)
    {
        ModeRun Get(Mode m)
        {
            foreach (var r in allEight)
                if (r.Mode == m) return r;
            throw new ArgumentException("the runs must cover all eight modes", nameof(allEight));
        }
        var main = ModeDiffer.Compare(Get(Mode.Legacy), Get(Mode.Modern), script, options);
        var pairCounts = new Dictionary<string, int>[3];
        for (var axis = 0; axis < 3; axis++)
        {
            pairCounts[axis] = new Dictionary<string, int>(StringComparer.Ordinal);
            foreach (var from in Mode.All)
            {
                if (!IsLegacySide(from, axis)) continue;
                var to = Flip(from, axis);
                foreach (var f in ModeDiffer.Compare(Get(from), Get(to), script, options))
                {
                    var key = Place(f);
                    pairCounts[axis][key] = pairCounts[axis].GetValueOrDefault(key) + 1;
                }
            }
        }
        var rows = new List<(Finding, int[])>(main.Count);
        foreach (var f in main)
        {
            var key = Place(f);
            rows.Add((f, [pairCounts[0].GetValueOrDefault(key), pairCounts[1].GetValueOrDefault(key), pairCounts[2].GetValueOrDefault(key)]));
        }
        return rows;
    }

    public static string Render(IReadOnlyList<(Finding Finding, int[] PairsPerAxis)> rows)
    {
        var first = new List<string>(rows.Count);
        foreach (var (f, _) in rows)
        {
            var sb = new StringBuilder();
            sb.Append(f.KindLabel).Append(" line ").Append(f.Line.ToString(CultureInfo.InvariantCulture));
            if (f.Checkpoint is not null) sb.Append(" checkpoint ").Append(CellText.Quote(f.Checkpoint));
            if (f.Column is not null) sb.Append(" column ").Append(CellText.Quote(f.Column));
            first.Add(sb.ToString());
        }
        var width = "finding".Length;
        foreach (var s in first) width = Math.Max(width, s.Length);
        var output = new StringBuilder();
        output.Append("finding".PadRight(width)).Append("  strings  missing  writes\n");
        for (var i = 0; i < rows.Count; i++)
        {
            output.Append(first[i].PadRight(width));
            foreach (var n in rows[i].PairsPerAxis)
            {
                output.Append("  ").Append((n == 0 ? "-" : n.ToString(CultureInfo.InvariantCulture) + "/4").PadRight(7));
            }
            TrimEnd(output);
            output.Append('\n');
        }
        if (rows.Count == 0) output.Append("(no findings between legacy and modern)\n");
        output.Append("n/4: the finding appears in n of the 4 mode pairs that differ in that axis only\n");
        return output.ToString();
    }

    private static void TrimEnd(StringBuilder sb)
    {
        while (sb.Length > 0 && sb[^1] == ' ') sb.Length--;
    }

    private static string Place(Finding f) =>
        f.KindLabel + "\u0001" + (f.Checkpoint ?? "line " + f.Line.ToString(CultureInfo.InvariantCulture)) + "\u0001" + (f.Column ?? "");

    private static bool IsLegacySide(Mode m, int axis) => axis switch
    {
        0 => m.IsBoxed,
        1 => m.IsNan,
        _ => m.IsAlias,
    };

    private static Mode Flip(Mode m, int axis) => axis switch
    {
        0 => m with { Strings = StringStorage.Arrow },
        1 => m with { Missing = MissingMarker.Null },
        _ => m with { Writes = WriteSemantics.Cow },
    };
}
