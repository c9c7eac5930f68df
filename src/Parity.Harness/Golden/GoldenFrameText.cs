using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using Parity.Engine.Frames;
using Parity.Engine.Values;
using Parity.Harness.Formatting;
using Parity.Harness.Golden.Internal;

namespace Parity.Harness.Golden;

/// <summary>
/// Writes and reads a checkpoint frame's golden text (docs/golden-format.md). Lines end with <c>\n</c>,
/// the text is UTF-8 without a byte order mark, and nothing depends on culture or time zone.
/// </summary>
public static class GoldenFrameText
{
    public const string Magic = "# parity golden frame 1";
    public const string CellSeparator = " | ";
    public const int PreviewRows = 5;

    /// <summary>The frame's text; when <paramref name="table"/> has more rows than <paramref name="rowLimit"/> the data goes to <paramref name="arrowFile"/>.</summary>
    public static string Write(string label, string mode, Table table, int rowLimit, string arrowFile)
    {
        var sb = new StringBuilder();
        sb.Append(Magic).Append('\n');
        sb.Append("label ").Append(CellText.Quote(label)).Append('\n');
        sb.Append("mode ").Append(mode).Append('\n');
        sb.Append("rows ").Append(table.RowCount.ToString(CultureInfo.InvariantCulture)).Append('\n');
        AppendColumns(sb, table);
        if (table.RowCount <= rowLimit)
        {
            sb.Append("data\n");
            for (var r = 0; r < table.RowCount; r++) AppendRow(sb, table, r);
            return sb.ToString();
        }
        sb.Append("arrow ").Append(CellText.Quote(arrowFile)).Append('\n');
        sb.Append("sha256 ").Append(ContentHash(table)).Append('\n');
        for (var c = 0; c < table.ColumnCount; c++)
        {
            var counts = new long[5];
            var col = table.Columns[c];
            for (var r = 0; r < table.RowCount; r++)
                if (col.IsMissing(r)) counts[(int)col.GetValue(r).Missing]++;
            for (var k = 1; k < counts.Length; k++)
            {
                if (counts[k] == 0) continue;
                sb.Append("missing ").Append(CellText.Quote(table.Names[c])).Append(' ')
                  .Append(ValueText.MissingName((MissingKind)k)).Append(' ')
                  .Append(counts[k].ToString(CultureInfo.InvariantCulture)).Append('\n');
            }
        }
        var preview = Math.Min(PreviewRows, table.RowCount);
        sb.Append("preview ").Append(preview.ToString(CultureInfo.InvariantCulture)).Append('\n');
        for (var r = 0; r < preview; r++) AppendRow(sb, table, r);
        return sb.ToString();
    }

    /// <summary>
    /// SHA-256 (lower-case hex) of the UTF-8 bytes of the column lines and then every row line, as an inline
    /// file would hold them, each ending in <c>\n</c> (FIPS 180-4). Independent of the Arrow writer.
    /// </summary>
    public static string ContentHash(Table table)
    {
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        var sb = new StringBuilder();
        AppendColumns(sb, table);
        Feed(hash, sb);
        for (var r = 0; r < table.RowCount; r++)
        {
            AppendRow(sb, table, r);
            if (sb.Length > 64 * 1024) Feed(hash, sb);
        }
        Feed(hash, sb);
        return Convert.ToHexStringLower(hash.GetHashAndReset());
    }

    private static void Feed(IncrementalHash hash, StringBuilder sb)
    {
        hash.AppendData(Encoding.UTF8.GetBytes(sb.ToString()));
        sb.Clear();
    }

    private static void AppendColumns(StringBuilder sb, Table table)
    {
        for (var c = 0; c < table.ColumnCount; c++)
            sb.Append("column ").Append(CellText.Quote(table.Names[c])).Append(' ').Append(table.Columns[c].TypeLabel).Append('\n');
    }

    private static void AppendRow(StringBuilder sb, Table table, int r)
    {
        for (var c = 0; c < table.ColumnCount; c++)
        {
            if (c > 0) sb.Append(CellSeparator);
            sb.Append(CellText.Display(table.Columns[c].GetValue(r)));
        }
        sb.Append('\n');
    }

    public static GoldenFrame Read(string text, string file)
    {
        var cur = new LineCursor(text, file);
        cur.NextOrFail("the header line");
        if (!string.Equals(cur.Line, Magic, StringComparison.Ordinal)) throw cur.Fail("not a golden frame file: the first line must be '" + Magic + "'");
        cur.NextOrFail("label");
        cur.Expect("label");
        var label = cur.Quoted();
        cur.EndOfLine();
        cur.NextOrFail("mode");
        cur.Expect("mode");
        var mode = cur.Word();
        if (!Parity.Engine.Modes.Mode.TryParse(mode, out _)) throw cur.FailAt(5, "not a mode: " + CellText.Quote(mode));
        cur.EndOfLine();
        cur.NextOrFail("rows");
        cur.Expect("rows");
        var rows = (int)cur.Integer(0, int.MaxValue);
        cur.EndOfLine();
        var columns = new List<GoldenColumn>();
        while (true)
        {
            cur.NextOrFail("'column', 'data' or 'arrow'");
            if (!string.Equals(cur.PeekWord(), "column", StringComparison.Ordinal)) break;
            cur.Expect("column");
            var name = cur.Quoted();
            cur.SkipSpaces();
            var typeAt = cur.Position;
            var type = cur.Word();
            if (!Parity.Engine.Columns.ColumnTypes.TryParseLabel(type, out _)) throw cur.FailAt(typeAt, "not a type label: " + CellText.Quote(type));
            cur.EndOfLine();
            columns.Add(new GoldenColumn(name, type));
        }
        var word = cur.PeekWord();
        if (string.Equals(word, "data", StringComparison.Ordinal))
        {
            cur.Expect("data");
            cur.EndOfLine();
            var data = new List<Value[]>(rows);
            for (var r = 0; r < rows; r++)
            {
                cur.NextOrFail("row " + (r + 1).ToString(CultureInfo.InvariantCulture) + " of " + rows.ToString(CultureInfo.InvariantCulture));
                data.Add(ReadRow(cur, columns.Count));
            }
            if (cur.Next()) throw cur.Fail("more row lines than the header's 'rows " + rows.ToString(CultureInfo.InvariantCulture) + "'");
            return new GoldenFrame { Label = label, Mode = mode, Rows = rows, Columns = columns, Data = data };
        }
        cur.Expect("arrow");
        var arrow = cur.Quoted();
        if (arrow.Contains('/', StringComparison.Ordinal) || arrow.Contains('\\', StringComparison.Ordinal) || arrow.StartsWith('.'))
            throw cur.FailAt(6, "the Arrow file must be a plain file name beside this file");
        cur.EndOfLine();
        cur.NextOrFail("sha256");
        cur.Expect("sha256");
        cur.SkipSpaces();
        var hashAt = cur.Position;
        var sha = cur.Word();
        if (sha.Length != 64 || !IsLowerHex(sha)) throw cur.FailAt(hashAt, "expected 64 lower-case hex digits");
        cur.EndOfLine();
        var missing = new List<GoldenMissingCount>();
        while (true)
        {
            cur.NextOrFail("'missing' or 'preview'");
            if (!string.Equals(cur.PeekWord(), "missing", StringComparison.Ordinal)) break;
            cur.Expect("missing");
            var col = cur.Quoted();
            cur.SkipSpaces();
            var markerAt = cur.Position;
            var marker = cur.Word();
            if (marker is not ("NaN" or "None" or "null" or "NaT")) throw cur.FailAt(markerAt, "expected NaN, None, null or NaT");
            var count = cur.Integer(1);
            cur.EndOfLine();
            missing.Add(new GoldenMissingCount(col, marker, count));
        }
        cur.Expect("preview");
        var n = (int)cur.Integer(0, Math.Min(rows, PreviewRows));
        cur.EndOfLine();
        var preview = new List<Value[]>(n);
        for (var r = 0; r < n; r++)
        {
            cur.NextOrFail("preview row");
            preview.Add(ReadRow(cur, columns.Count));
        }
        if (cur.Next()) throw cur.Fail("unexpected line after the preview");
        return new GoldenFrame
        {
            Label = label, Mode = mode, Rows = rows, Columns = columns, ArrowFile = arrow, Sha256 = sha, Missing = missing, Preview = preview,
        };
    }

    private static bool IsLowerHex(string s)
    {
        foreach (var c in s)
            if (c is not (>= '0' and <= '9' or >= 'a' and <= 'f')) return false;
        return true;
    }

    /// <summary>Reads one row line: cells separated by <see cref="CellSeparator"/>; a string cell is quoted, so a separator inside it is data.</summary>
    private static Value[] ReadRow(LineCursor cur, int columns)
    {
        var line = cur.Line;
        var cells = new Value[columns];
        var pos = 0;
        if (columns == 0)
        {
            if (line.Length != 0) throw cur.FailAt(0, "a frame without columns has empty row lines");
            return cells;
        }
        for (var c = 0; c < columns; c++)
        {
            if (c > 0)
            {
                if (string.CompareOrdinal(line, pos, CellSeparator, 0, CellSeparator.Length) != 0)
                    throw cur.FailAt(pos, pos >= line.Length ? "the row has " + c.ToString(CultureInfo.InvariantCulture) + " cells, expected " + columns.ToString(CultureInfo.InvariantCulture) : "expected ' | ' between cells");
                pos += CellSeparator.Length;
            }
            int end;
            if (pos < line.Length && line[pos] == '\'')
            {
                end = CellText.ScanQuoted(line, pos, out _, out var err);
                if (end < 0) throw cur.FailAt(pos, err ?? "bad string");
            }
            else
            {
                end = line.IndexOf(' ', pos);
                if (end < 0) end = line.Length;
            }
            if (!CellText.TryParse(line.AsSpan(pos, end - pos), out var v, out var error)) throw cur.FailAt(pos, error ?? "bad cell");
            cells[c] = v;
            pos = end;
        }
        if (pos != line.Length) throw cur.FailAt(pos, "more cells than the " + columns.ToString(CultureInfo.InvariantCulture) + " columns");
        return cells;
    }
}
