using System.Text;
using nietras.SeparatedValues;
using Parity.Engine.Errors;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// Reads a CSV file (RFC 4180) with Sep into the mode-neutral form. Sep splits records and fields (quotes,
/// CRLF, newlines inside quotes); we take the raw field text and check and unescape the quoting ourselves,
/// so a malformed field is an error with its line and field number instead of a silent guess.
/// </summary>
internal static class CsvSourceReader
{
    public static SourceTable Read(string path, string display, LoadOptions options)
    {
        var tokens = options.MissingTokens ?? [""];
        Stream stream;
        try
        {
            stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        }
        catch (Exception ex) when (ex is FileNotFoundException or DirectoryNotFoundException)
        {
            throw LoadThrow.FileNotFound(display);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or NotSupportedException or ArgumentException)
        {
            throw LoadThrow.FileRead(display, ex.Message);
        }
        // The encoding's preamble makes StreamReader skip a UTF-8 byte order mark; throwOnInvalidBytes turns
        // a malformed sequence into an exception we locate below instead of a silent U+FFFD.
        using var text = new StreamReader(stream, new UTF8Encoding(encoderShouldEmitUTF8Identifier: true, throwOnInvalidBytes: true), detectEncodingFromByteOrderMarks: false, 1 << 16);
        try
        {
            var (columns, rows) = ReadRows(text, display, options.Delimiter, tokens, null, stream.Length);
            bool[]? again = null;
            for (var c = 0; c < columns.Length; c++)
            {
                if (!columns[c].NeedsText) continue;
                again ??= new bool[columns.Length];
                again[c] = true;
            }
            if (again is not null)
            {
                // Second pass: only the columns that stopped being numbers, text kept from the first row.
                using var stream2 = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
                using var text2 = new StreamReader(stream2, new UTF8Encoding(encoderShouldEmitUTF8Identifier: true, throwOnInvalidBytes: true), detectEncodingFromByteOrderMarks: false, 1 << 16);
                var (filled, rows2) = ReadRows(text2, display, options.Delimiter, tokens, again, stream2.Length);
                if (rows2 != rows || filled.Length != columns.Length)
                    throw LoadThrow.FileRead(display, "the file changed while it was being read");
                for (var c = 0; c < columns.Length; c++)
                    if (again[c]) columns[c] = filled[c];
            }
            var result = new SourceColumn[columns.Length];
            for (var c = 0; c < columns.Length; c++) result[c] = columns[c].Finish();
            return new SourceTable(result, rows);
        }
        catch (EngineException)
        {
            throw;
        }
        catch (Exception ex) when (FindDecoderError(ex))
        {
            var (row, col) = LocateInvalidUtf8(path, options.Delimiter);
            throw LoadThrow.Error(ErrorCodes.Utf8, display, "invalid UTF-8 byte sequence", row, col);
        }
        catch (IOException ex)
        {
            throw LoadThrow.FileRead(display, ex.Message);
        }
        catch (OutOfMemoryException)
        {
            throw LoadThrow.OutOfMemory(display);
        }
        catch (Exception ex)
        {
            throw LoadThrow.Format(display, "cannot parse as CSV: " + ex.Message);
        }
    }

    /// <summary>Reads every record; with <paramref name="only"/>, fills just those columns, as text.</summary>
    private static (CsvColumnBuilder[] Columns, int Rows) ReadRows(TextReader text, string display, char delimiter, IReadOnlyList<string> tokens, bool[]? only, long fileLength)
    {
        const int SampleRows = 4096;
        long sampleChars = 0;
        SepReaderOptions sepOptions;
        try
        {
            sepOptions = new SepReaderOptions(Sep.New(delimiter)) { HasHeader = false, DisableColCountCheck = true, Unescape = false };
        }
        catch (ArgumentException)
        {
            throw LoadThrow.Error(ErrorCodes.BadOption, display, $"'{delimiter}' cannot be a CSV delimiter");
        }
        using var reader = sepOptions.From(text);
        CsvColumnBuilder[]? columns = null;
        var scratch = new char[256];
        var line = 1;
        var rows = 0;
        foreach (var row in reader)
        {
            var rowLine = line;
            line = row.LineNumberToExcl;
            if (row.Span.IsEmpty) continue; // a blank line is no record
            if (columns is null)
            {
                columns = ReadHeader(row, rowLine, display, ref scratch, only);
                continue;
            }
            if (row.ColCount != columns.Length)
            {
                var col = Math.Min(row.ColCount, columns.Length) + 1;
                throw LoadThrow.Error(ErrorCodes.CsvRagged, display,
                    $"record has {row.ColCount} fields, the header has {columns.Length}", rowLine, col);
            }
            if (rows < SampleRows)
            {
                sampleChars += row.Span.Length + 1;
                if (rows == SampleRows - 1 && fileLength > 64L * sampleChars)
                {
                    // A large file: size every column for the rows the sample predicts (10% over).
                    var estimate = Math.Min(fileLength / Math.Max(1, sampleChars / SampleRows) * 11 / 10, System.Array.MaxLength - 16);
                    foreach (var b in columns) b.Reserve((int)estimate);
                }
            }
            for (var c = 0; c < columns.Length; c++)
            {
                if (only is not null && (c >= only.Length || !only[c])) continue;
                var value = Unquote(row[c].Span, ref scratch, display, rowLine, c + 1);
                if (IsMissing(value, tokens))
                    columns[c].AppendMissing();
                else if (!columns[c].Append(value))
                    throw LoadThrow.Error(ErrorCodes.FileRead, display, $"column '{columns[c].Name}' holds more than 2 GiB of text", rowLine, c + 1);
            }
            rows++;
        }
        if (columns is null)
            throw LoadThrow.Error(ErrorCodes.CsvHeader, display, "the file is empty: a header row is required", 1, 0);
        return (columns, rows);
    }

    private static CsvColumnBuilder[] ReadHeader(nietras.SeparatedValues.SepReader.Row row, int line, string display, ref char[] scratch, bool[]? textOnly)
    {
        var columns = new CsvColumnBuilder[row.ColCount];
        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (var c = 0; c < columns.Length; c++)
        {
            var name = Unquote(row[c].Span, ref scratch, display, line, c + 1).ToString();
            if (name.Length == 0)
                throw LoadThrow.Error(ErrorCodes.CsvHeader, display, $"header field {c + 1} is empty: every column needs a name", line, c + 1);
            if (!seen.Add(name))
                throw LoadThrow.Error(ErrorCodes.CsvHeader, display, $"duplicate column name '{name}' in the header", line, c + 1);
            columns[c] = new CsvColumnBuilder(name, textOnly is not null && c < textOnly.Length && textOnly[c]);
        }
        return columns;
    }

    internal static bool IsMissing(ReadOnlySpan<char> value, IReadOnlyList<string> tokens)
    {
        if (tokens.Count == 1 && tokens[0].Length == 0) return value.IsEmpty; // the default
        for (var i = 0; i < tokens.Count; i++)
            if (value.SequenceEqual(tokens[i])) return true;
        return false;
    }

    /// <summary>
    /// RFC 4180 §2 rules 5-7: a field is either free of quotes, or enclosed in double quotes with every
    /// quote inside doubled. Returns the field's value; the scratch buffer holds it when it had escapes.
    /// </summary>
    internal static ReadOnlySpan<char> Unquote(ReadOnlySpan<char> raw, ref char[] scratch, string display, int line, int field)
    {
        if (raw.IsEmpty || raw[0] != '"')
        {
            if (raw.Contains('"'))
                throw LoadThrow.Error(ErrorCodes.CsvQuote, display, "a quote inside an unquoted field (RFC 4180: such a field must be enclosed in quotes)", line, field);
            return raw;
        }
        var inner = raw[1..];
        var length = 0;
        var escaped = false;
        var i = 0;
        while (true)
        {
            var q = inner[i..].IndexOf('"');
            if (q < 0)
                throw LoadThrow.Error(ErrorCodes.CsvQuote, display, "quoted field is not closed before the end of the file", line, field);
            var end = i + q;
            if (end + 1 < inner.Length && inner[end + 1] == '"')
            {
                escaped = true;
                i = end + 2;
                continue;
            }
            if (end + 1 != inner.Length)
                throw LoadThrow.Error(ErrorCodes.CsvQuote, display, "text after the closing quote of a quoted field", line, field);
            length = end;
            break;
        }
        var content = inner[..length];
        if (!escaped) return content;
        if (scratch.Length < content.Length) scratch = new char[Math.Max(content.Length, scratch.Length * 2)];
        var n = 0;
        for (var k = 0; k < content.Length; k++)
        {
            scratch[n++] = content[k];
            if (content[k] == '"') k++; // skip the second quote of a pair
        }
        return scratch.AsSpan(0, n);
    }

    private static bool FindDecoderError(Exception? ex)
    {
        for (; ex is not null; ex = ex.InnerException)
            if (ex is DecoderFallbackException) return true;
        return false;
    }

    /// <summary>
    /// The line and field of the first invalid UTF-8 sequence (error path only): scan the bytes with the
    /// quote state so newlines inside quoted fields count as lines, as Sep counts them.
    /// </summary>
    private static (int Row, int Col) LocateInvalidUtf8(string path, char delimiter)
    {
        try
        {
            var info = new FileInfo(path);
            if (info.Length > int.MaxValue / 2) return (0, 0);
            var bytes = File.ReadAllBytes(path);
            var start = bytes.AsSpan().StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]) ? 3 : 0;
            var status = System.Text.Unicode.Utf8.ToUtf16(bytes.AsSpan(start), new char[bytes.Length], out var read, out _, replaceInvalidSequences: false);
            if (status == System.Buffers.OperationStatus.Done) return (0, 0);
            var bad = start + read;
            int line = 1, recordLine = 1, field = 1;
            var inQuotes = false;
            var atFieldStart = true;
            for (var i = start; i < bad; i++)
            {
                var b = bytes[i];
                if (b == '"')
                {
                    if (atFieldStart || inQuotes) inQuotes = !inQuotes;
                }
                else if (b == '\n')
                {
                    line++;
                    if (!inQuotes) { recordLine = line; field = 1; atFieldStart = true; continue; }
                }
                else if (b == delimiter && !inQuotes)
                {
                    field++;
                    atFieldStart = true;
                    continue;
                }
                atFieldStart = false;
            }
            return (recordLine, field);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return (0, 0);
        }
    }
}
