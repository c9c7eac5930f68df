using System.Globalization;
using System.Text;
using Parity.Harness.Showing;

namespace Parity.Harness.Inspection;

/// <summary>
/// The terminal form of <c>parity inspect</c>: a header line, then one aligned row per column (name, legacy
/// type, modern type, missing, bytes boxed, bytes arrow) and a total row. Control characters in names are
/// shown as <c>\uXXXX</c> so data cannot move the cursor or forge lines.
/// </summary>
public static class InspectionTextWriter
{
    private static readonly string[] Headings = ["column", "legacy", "modern", "missing", "bytes boxed", "bytes arrow"];

    public static void Write(DataInspection inspection, TextWriter output)
    {
        output.Write(Safe(inspection.File) + ": " + Count(inspection.Rows, "row") + ", " + Count(inspection.Columns.Count, "column") + "\n\n");
        var rows = new List<string[]> { Headings };
        foreach (var c in inspection.Columns)
            rows.Add([Safe(c.Name), c.TypeOf("legacy"), c.TypeOf("modern"), Num(c.Missing), Num(c.BytesBoxed), Num(c.BytesArrow)]);
        rows.Add(["total", "", "", Num(inspection.Missing), Num(inspection.BytesBoxed), Num(inspection.BytesArrow)]);
        var widths = new int[Headings.Length];
        foreach (var r in rows)
            for (var i = 0; i < r.Length; i++) widths[i] = Math.Max(widths[i], DisplayWidth.Of(r[i]));
        for (var k = 0; k < rows.Count; k++)
        {
            if (k == rows.Count - 1) output.Write(Rule(widths) + "\n");
            var r = rows[k];
            var line = new StringBuilder();
            for (var i = 0; i < r.Length; i++)
            {
                if (i > 0) line.Append("  ");
                // Text columns left-aligned, numbers right-aligned; pad by display width (wide CJK and emoji count 2).
                var pad = new string(' ', widths[i] - DisplayWidth.Of(r[i]));
                line.Append(i < 3 ? r[i] + pad : pad + r[i]);
            }
            output.Write(line.ToString().TrimEnd() + "\n");
        }
    }

    private static string Rule(int[] widths)
    {
        var total = 0;
        foreach (var w in widths) total += w;
        return new string('-', total + 2 * (widths.Length - 1));
    }

    private static string Num(long n) => n.ToString(CultureInfo.InvariantCulture);

    private static string Count(int n, string noun) => Num(n) + " " + noun + (n == 1 ? "" : "s");

    private static string Safe(string text)
    {
        var sb = new StringBuilder(text.Length);
        foreach (var ch in text)
        {
            if (char.IsControl(ch) || ch is '\u2028' or '\u2029')
                sb.Append("\\u").Append(((int)ch).ToString("X4", CultureInfo.InvariantCulture));
            else
                sb.Append(ch);
        }
        return sb.ToString();
    }
}
