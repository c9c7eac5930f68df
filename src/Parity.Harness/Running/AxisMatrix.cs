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

    /// <summary>
    /// The table: one row per legacy-vs-modern finding with, per axis, how many of its four pairs show it, and
    /// its causes. A cause is a set of axes S such that legacy against legacy with S flipped shows a finding
    /// of the same kind, place and column, and no smaller such set is inside S (seven comparisons per script;
    /// flipping all three axes is modern itself, so every finding has at least one cause).
    /// </summary>
    public static IReadOnlyList<MatrixRow> Build(IReadOnlyList<ModeRun> allEight, string script, DiffOptions options)
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
        // Bit i of a mask flips axis i; mask 7 is modern, whose findings are the main ones.
        var flipped = new HashSet<string>[8];
        for (var mask = 1; mask < 8; mask++)
        {
            flipped[mask] = new HashSet<string>(StringComparer.Ordinal);
            var target = Mode.Legacy;
            for (var axis = 0; axis < 3; axis++)
                if ((mask & (1 << axis)) != 0) target = Flip(target, axis);
            foreach (var f in mask == 7 ? main : ModeDiffer.Compare(Get(Mode.Legacy), Get(target), script, options))
                flipped[mask].Add(Place(f));
        }
        var rows = new List<MatrixRow>(main.Count);
        foreach (var f in main)
        {
            var key = Place(f);
            rows.Add(new MatrixRow(f, [pairCounts[0].GetValueOrDefault(key), pairCounts[1].GetValueOrDefault(key), pairCounts[2].GetValueOrDefault(key)], Causes(flipped, key)));
        }
        return rows;
    }

    internal static List<IReadOnlyList<string>> Causes(HashSet<string>[] flipped, string key)
    {
        var reproducing = new List<int>();
        for (var mask = 1; mask < 8; mask++)
            if (flipped[mask].Contains(key)) reproducing.Add(mask);
        // Smaller sets first, then in axis order: the order the JSON lists them.
        reproducing.Sort((x, y) => BitCount(x) != BitCount(y) ? BitCount(x).CompareTo(BitCount(y)) : AxisOrder(x).CompareTo(AxisOrder(y)));
        var causes = new List<IReadOnlyList<string>>();
        var kept = new List<int>();
        foreach (var mask in reproducing)
        {
            var minimal = true;
            foreach (var k in kept)
                if ((k & mask) == k) { minimal = false; break; }
            if (!minimal) continue;
            kept.Add(mask);
            var names = new List<string>(3);
            for (var axis = 0; axis < 3; axis++)
                if ((mask & (1 << axis)) != 0) names.Add(Axes[axis]);
            causes.Add(names);
        }
        return causes;
    }

    private static int BitCount(int mask) => System.Numerics.BitOperations.PopCount((uint)mask);

    /// <summary>Orders masks of one size by their axes read left to right (strings before missing before writes).</summary>
    private static int AxisOrder(int mask) => (int)(((mask & 1) << 2) | (mask & 2) | ((mask & 4) >> 2)) ^ 7;

    /// <summary>A cause written for people: <c>strings</c>, <c>strings+missing</c>, alternatives joined by <c>|</c>.</summary>
    public static string CauseText(IReadOnlyList<IReadOnlyList<string>> causes)
    {
        var parts = new List<string>(causes.Count);
        foreach (var c in causes) parts.Add(string.Join("+", c));
        return string.Join(" | ", parts);
    }

    public static string Render(IReadOnlyList<MatrixRow> rows)
    {
        var first = new List<string>(rows.Count);
        foreach (var row in rows)
        {
            var f = row.Finding;
            var sb = new StringBuilder();
            sb.Append(f.KindLabel).Append(" line ").Append(f.Line.ToString(CultureInfo.InvariantCulture));
            if (f.Checkpoint is not null) sb.Append(" checkpoint ").Append(CellText.Quote(f.Checkpoint));
            if (f.Column is not null) sb.Append(" column ").Append(CellText.Quote(f.Column));
            first.Add(sb.ToString());
        }
        var width = "finding".Length;
        foreach (var s in first) width = Math.Max(width, s.Length);
        var output = new StringBuilder();
        output.Append("finding".PadRight(width)).Append("  strings  missing  writes  caused by\n");
        for (var i = 0; i < rows.Count; i++)
        {
            output.Append(first[i].PadRight(width));
            foreach (var n in rows[i].PairsPerAxis)
            {
                output.Append("  ").Append((n == 0 ? "-" : n.ToString(CultureInfo.InvariantCulture) + "/4").PadRight(7));
            }
            output.Append("  ").Append(CauseText(rows[i].Causes));
            TrimEnd(output);
            output.Append('\n');
        }
        if (rows.Count == 0) output.Append("(no findings between legacy and modern)\n");
        output.Append("n/4: the finding appears in n of the 4 mode pairs that differ in that axis only; caused by: the smallest sets of axes whose flip alone, from legacy, shows it (a | b: either one)\n");
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
