using System.Text;
using nietras.SeparatedValues;
using Parity.Engine.Errors;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// A CSV file held as the unquoted text of every field (UTF-8, per column), so that any subset of its rows
/// can be typed exactly as the loader would type a file holding only those rows: type inference (docs/data.md)
/// depends on which rows are present, so a reduced fixture cannot reuse the full file's column types.
/// </summary>
internal sealed class CsvTextTable
{
    private readonly string[] _names;
    private readonly byte[][] _data;
    private readonly int[][] _offsets;

    private CsvTextTable(string[] names, byte[][] data, int[][] offsets, int rows)
    {
        _names = names;
        _data = data;
        _offsets = offsets;
        RowCount = rows;
    }

    public IReadOnlyList<string> Names => _names;

    public int RowCount { get; }

    /// <summary>Reads every record of <paramref name="path"/> (RFC 4180, UTF-8) with the loader's quoting rules.</summary>
    public static CsvTextTable Read(string path, string display, char delimiter)
    {
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (Exception ex) when (ex is FileNotFoundException or DirectoryNotFoundException)
        {
            throw LoadThrow.FileNotFound(display);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or NotSupportedException or ArgumentException)
        {
            throw LoadThrow.FileRead(display, ex.Message);
        }
        string text;
        try
        {
            var start = bytes.AsSpan().StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]) ? 3 : 0;
            text = new UTF8Encoding(false, throwOnInvalidBytes: true).GetString(bytes, start, bytes.Length - start);
        }
        catch (DecoderFallbackException)
        {
            throw LoadThrow.Error(ErrorCodes.Utf8, display, "invalid UTF-8 byte sequence");
        }
        SepReaderOptions options;
        try
        {
            options = new SepReaderOptions(Sep.New(delimiter)) { HasHeader = false, DisableColCountCheck = true, Unescape = false };
        }
        catch (ArgumentException)
        {
            throw LoadThrow.Error(ErrorCodes.BadOption, display, $"'{delimiter}' cannot be a CSV delimiter");
        }
        using var reader = options.FromText(text);
        string[]? names = null;
        MemoryStream[] data = [];
        List<int>[] offsets = [];
        var scratch = new char[256];
        var encoded = new byte[1024];
        var line = 1;
        var rows = 0;
        foreach (var row in reader)
        {
            var rowLine = line;
            line = row.LineNumberToExcl;
            if (row.Span.IsEmpty) continue; // a blank line is no record, as in the loader
            if (names is null)
            {
                names = new string[row.ColCount];
                for (var c = 0; c < names.Length; c++) names[c] = CsvSourceReader.Unquote(row[c].Span, ref scratch, display, rowLine, c + 1).ToString();
                data = new MemoryStream[names.Length];
                offsets = new List<int>[names.Length];
                for (var c = 0; c < names.Length; c++)
                {
                    data[c] = new MemoryStream();
                    offsets[c] = [0];
                }
                continue;
            }
            if (row.ColCount != names.Length)
                throw LoadThrow.Error(ErrorCodes.CsvRagged, display, $"record has {row.ColCount} fields, the header has {names.Length}", rowLine, Math.Min(row.ColCount, names.Length) + 1);
            for (var c = 0; c < names.Length; c++)
            {
                var value = CsvSourceReader.Unquote(row[c].Span, ref scratch, display, rowLine, c + 1);
                var max = Encoding.UTF8.GetMaxByteCount(value.Length);
                if (encoded.Length < max) encoded = new byte[Math.Max(max, encoded.Length * 2)];
                var n = Encoding.UTF8.GetBytes(value, encoded);
                data[c].Write(encoded, 0, n);
                if (data[c].Length > int.MaxValue) throw LoadThrow.Error(ErrorCodes.FileRead, display, $"column '{names[c]}' holds more than 2 GiB of text", rowLine, c + 1);
                offsets[c].Add((int)data[c].Length);
            }
            rows++;
        }
        if (names is null)
            throw LoadThrow.Error(ErrorCodes.CsvHeader, display, "the file is empty: a header row is required", 1, 0);
        var bytesPerColumn = new byte[names.Length][];
        var offsetsPerColumn = new int[names.Length][];
        for (var c = 0; c < names.Length; c++)
        {
            bytesPerColumn[c] = data[c].ToArray();
            offsetsPerColumn[c] = offsets[c].ToArray();
        }
        return new CsvTextTable(names, bytesPerColumn, offsetsPerColumn, rows);
    }

    private ReadOnlySpan<byte> Cell(int column, int row) => _data[column].AsSpan(_offsets[column][row], _offsets[column][row + 1] - _offsets[column][row]);

    /// <summary>
    /// The table the loader would build from a file holding only <paramref name="rows"/> (in that order) and
    /// the columns <paramref name="keep"/> marks: every column is typed afresh by the loader's own builder.
    /// </summary>
    public SourceTable Select(int[] rows, bool[] keep, IReadOnlyList<string>? missingTokens)
    {
        var tokens = missingTokens ?? [""];
        var columns = new List<SourceColumn>();
        var chars = new char[256];
        for (var c = 0; c < _names.Length; c++)
        {
            if (!keep[c]) continue;
            var builder = Fill(new CsvColumnBuilder(_names[c]), c, rows, tokens, ref chars);
            // Same rule as the loader's second pass: a column that stopped being a number is read again as text.
            if (builder.NeedsText) builder = Fill(new CsvColumnBuilder(_names[c], textOnly: true), c, rows, tokens, ref chars);
            columns.Add(builder.Finish());
        }
        return new SourceTable(columns, rows.Length);
    }

    private CsvColumnBuilder Fill(CsvColumnBuilder builder, int column, int[] rows, IReadOnlyList<string> tokens, ref char[] chars)
    {
        builder.Reserve(rows.Length);
        foreach (var row in rows)
        {
            var bytes = Cell(column, row);
            if (chars.Length < bytes.Length) chars = new char[Math.Max(bytes.Length, chars.Length * 2)];
            var n = Encoding.UTF8.GetChars(bytes, chars);
            var value = chars.AsSpan(0, n);
            if (CsvSourceReader.IsMissing(value, tokens)) builder.AppendMissing();
            else builder.Append(value);
        }
        return builder;
    }

    /// <summary>
    /// Writes the header and <paramref name="rows"/> of the <paramref name="keep"/> columns as CSV (RFC 4180:
    /// a field holding the delimiter, a quote, CR or LF is quoted with inner quotes doubled; LF line ends).
    /// </summary>
    public void Write(Stream stream, int[] rows, bool[] keep, char delimiter)
    {
        using var w = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true) { NewLine = "\n" };
        var first = true;
        for (var c = 0; c < _names.Length; c++)
        {
            if (!keep[c]) continue;
            if (!first) w.Write(delimiter);
            first = false;
            WriteField(w, _names[c], delimiter);
        }
        w.Write('\n');
        var single = 0;
        foreach (var k in keep) if (k) single++;
        foreach (var row in rows)
        {
            if (single == 1 && RowIsEmpty(row, keep))
            {
                // One column and an empty field: a bare empty line is no record, so quote it (RFC 4180 §2 rule 5).
                w.Write("\"\"\n");
                continue;
            }
            first = true;
            for (var c = 0; c < _names.Length; c++)
            {
                if (!keep[c]) continue;
                if (!first) w.Write(delimiter);
                first = false;
                WriteField(w, Encoding.UTF8.GetString(Cell(c, row)), delimiter);
            }
            w.Write('\n');
        }
    }

    private bool RowIsEmpty(int row, bool[] keep)
    {
        for (var c = 0; c < _names.Length; c++)
            if (keep[c] && !Cell(c, row).IsEmpty) return false;
        return true;
    }

    private static void WriteField(StreamWriter w, string value, char delimiter)
    {
        if (value.AsSpan().IndexOfAny(['"', '\r', '\n', delimiter]) < 0)
        {
            w.Write(value);
            return;
        }
        w.Write('"');
        w.Write(value.Replace("\"", "\"\"", StringComparison.Ordinal));
        w.Write('"');
    }
}
