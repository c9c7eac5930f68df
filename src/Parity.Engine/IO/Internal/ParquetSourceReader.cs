using Apache.Arrow;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.IO.Internal.ParquetPages;
using Parquet;
using Parquet.Schema;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// Reads a flat Parquet file with Parquet.Net into the mode-neutral form: int64 (narrower integers widened),
/// double (float widened), bool, timestamps (DateTime, taken as UTC) and strings. Strings are read raw as
/// UTF-8 byte slices (a <c>DataField&lt;byte[]&gt;</c> read through <c>ReadRawAsync</c>) and copied once
/// into one contiguous buffer with int32 offsets: the Arrow layout, never through managed strings.
/// </summary>
internal static class ParquetSourceReader
{
    public static SourceTable Read(string path, string display)
    {
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
        using (stream)
        {
            var field = 0;
            try
            {
                return ReadAsync(stream, display, f => field = f).AsTask().GetAwaiter().GetResult();
            }
            catch (EngineException)
            {
                throw;
            }
            catch (OutOfMemoryException)
            {
                throw LoadThrow.OutOfMemory(display);
            }
            catch (Exception ex)
            {
                throw LoadThrow.Error(ErrorCodes.Parquet, display, "cannot read as Parquet: " + ex.Message, 0, field);
            }
        }
    }

    /// <summary>
    /// Parquet.Net 6.1.0 can loop forever on some corrupt footers (found by our fuzzer, kept as
    /// tests/Parity.Tests/Reliability/Cases/parquet-footer-hang.parquet). Opening runs on a task of its own
    /// with a time budget, so a bad file ends in a located error rather than a hang. The abandoned task keeps
    /// a thread busy until the process exits, which a CLI does right after reporting the error.
    /// </summary>
    private static async Task<ParquetReader> OpenAsync(Stream stream, string display)
    {
        var open = Task.Run(() => ParquetReader.CreateAsync(stream, leaveStreamOpen: true));
        var budget = OpenBudget();
        try
        {
            return await open.WaitAsync(budget).ConfigureAwait(false);
        }
        catch (TimeoutException)
        {
            throw LoadThrow.Error(ErrorCodes.Parquet, display,
                $"the file's metadata could not be read within {budget.TotalSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture)} s (corrupt footer?); "
                + "raise the budget with the environment variable " + OpenBudgetVariable);
        }
    }

    internal const string OpenBudgetVariable = "PARITY_PARQUET_OPEN_SECONDS";

    private static TimeSpan OpenBudget() =>
        double.TryParse(Environment.GetEnvironmentVariable(OpenBudgetVariable), System.Globalization.NumberStyles.Float,
            System.Globalization.CultureInfo.InvariantCulture, out var seconds) && seconds > 0
            ? TimeSpan.FromSeconds(seconds)
            : TimeSpan.FromSeconds(30);

    private static async ValueTask<SourceTable> ReadAsync(Stream stream, string display, Action<int> at)
    {
        if (ParquetFooterCheck.Problem(stream) is { } problem) throw LoadThrow.Error(ErrorCodes.Parquet, display, problem);
        await using var reader = await OpenAsync(stream, display).ConfigureAwait(false);
        var fields = reader.Schema.Fields;
        var dataFields = reader.Schema.GetDataFields();
        if (fields.Count != dataFields.Length)
            throw LoadThrow.Error(ErrorCodes.Parquet, display, "nested Parquet columns (lists, maps, structs) are not supported");
        long total = 0;
        for (var g = 0; g < reader.RowGroupCount; g++)
        {
            using var rg = reader.OpenRowGroupReader(g);
            total += rg.RowCount;
        }
        if (total > System.Array.MaxLength)
            throw LoadThrow.Error(ErrorCodes.Parquet, display, $"{total} rows are more than one table can hold");
        var n = (int)total;
        var columns = new SourceColumn[dataFields.Length];
        for (var c = 0; c < dataFields.Length; c++)
        {
            at(c + 1);
            var f = dataFields[c];
            if (f.MaxRepetitionLevel > 0)
                throw LoadThrow.Error(ErrorCodes.Parquet, display, $"column '{f.Name}' is repeated (a list); not supported", 0, c + 1);
            for (var g = 0; g < reader.RowGroupCount; g++)
            {
                using var rg = reader.OpenRowGroupReader(g);
                if (rg.ColumnExists(f) && rg.GetMetadata(f) is { MetaData: { } meta } && ParquetChunkCheck.Problem(stream, meta, rg.RowCount) is { } bad)
                    throw LoadThrow.Error(ErrorCodes.Parquet, display, $"column '{f.Name}': {bad}", 0, c + 1);
            }
            columns[c] = await ReadColumnAsync(reader, stream, f, n, display, c + 1).ConfigureAwait(false);
        }
        return new SourceTable(columns, n);
    }

    private static async ValueTask<SourceColumn> ReadColumnAsync(ParquetReader reader, Stream stream, DataField f, int n, string display, int col)
    {
        var t = f.ClrType;
        if (t == typeof(long)) return Int(f, await ReadWideAsync<long>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(int)) return Int(f, await ReadWideAsync<int>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(short)) return Int(f, await ReadWideAsync<short>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(sbyte)) return Int(f, await ReadWideAsync<sbyte>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(byte)) return Int(f, await ReadWideAsync<byte>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(ushort)) return Int(f, await ReadWideAsync<ushort>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(uint)) return Int(f, await ReadWideAsync<uint>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(double)) return Float(f, await ReadFloatAsync<double>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(float)) return Float(f, await ReadFloatAsync<float>(reader, f, n, v => v).ConfigureAwait(false));
        if (t == typeof(decimal)) return Float(f, await ReadFloatAsync<decimal>(reader, f, n, v => (double)v).ConfigureAwait(false));
        if (t == typeof(bool))
        {
            var (values, validity) = await ReadTypedAsync<bool, bool>(reader, f, n, v => v).ConfigureAwait(false);
            return new SourceBool(f.Name, values, validity);
        }
        if (t == typeof(DateTime))
        {
            var (values, validity) = await ReadTypedAsync<DateTime, long>(reader, f, n, ToMicros).ConfigureAwait(false);
            return new SourceTimestamp(f.Name, values, validity);
        }
        if (t == typeof(DateTimeOffset))
        {
            var (values, validity) = await ReadTypedAsync<DateTimeOffset, long>(reader, f, n, d => Values.ValueText.ToMicros(d)).ConfigureAwait(false);
            return new SourceTimestamp(f.Name, values, validity);
        }
        if (t == typeof(DateOnly))
        {
            var (values, validity) = await ReadTypedAsync<DateOnly, long>(reader, f, n, d => ToMicros(d.ToDateTime(TimeOnly.MinValue))).ConfigureAwait(false);
            return new SourceTimestamp(f.Name, values, validity);
        }
        if (t == typeof(ReadOnlyMemory<char>) || t == typeof(string) || t == typeof(byte[]) || t == typeof(ReadOnlyMemory<byte>))
            return await ReadStringsAsync(reader, stream, f, n, display, col).ConfigureAwait(false);
        throw LoadThrow.Error(ErrorCodes.Parquet, display, $"column '{f.Name}' has a type Parity does not load ({t.Name})", 0, col);
    }

    private static SourceInt64 Int(DataField f, (long[] Values, Validity Validity) r) => new(f.Name, r.Values, r.Validity);

    private static SourceFloat64 Float(DataField f, (double[] Values, Validity Validity) r) => new(f.Name, r.Values, r.Validity);

    private static long ToMicros(DateTime d) => (d.Ticks - DateTime.UnixEpoch.Ticks) / 10;

    private static ValueTask<(long[] Values, Validity Validity)> ReadWideAsync<T>(ParquetReader reader, DataField f, int n, Func<T, long> widen)
        where T : struct => ReadTypedAsync(reader, f, n, widen);

    private static ValueTask<(double[] Values, Validity Validity)> ReadFloatAsync<T>(ParquetReader reader, DataField f, int n, Func<T, double> widen)
        where T : struct => ReadTypedAsync(reader, f, n, widen);

    /// <summary>
    /// Reads every row group of a fixed-width column: <c>ReadRawAsync</c> packs the present values first and
    /// gives definition levels (max level = present); we scatter them to their rows and build the bitmap.
    /// </summary>
    private static async ValueTask<(TOut[] Values, Validity Validity)> ReadTypedAsync<TIn, TOut>(ParquetReader reader, DataField f, int n, Func<TIn, TOut> map)
        where TIn : struct
    {
        var result = new TOut[n];
        var bits = new byte[(n + 7) >> 3];
        var nulls = 0;
        var row = 0;
        var maxDef = f.MaxDefinitionLevel;
        for (var g = 0; g < reader.RowGroupCount; g++)
        {
            using var rg = reader.OpenRowGroupReader(g);
            var count = checked((int)rg.RowCount);
            var values = new TIn[count];
            var defs = new int[count];
            await rg.ReadRawAsync<TIn>(f, values, defs, null).ConfigureAwait(false);
            var k = 0;
            for (var i = 0; i < count; i++, row++)
            {
                if (maxDef == 0 || defs[i] == maxDef)
                {
                    result[row] = map(values[k++]);
                    bits[row >> 3] |= (byte)(1 << (row & 7));
                }
                else
                {
                    nulls++;
                }
            }
        }
        return (result, nulls == 0 ? Validity.AllValid(n) : new Validity(bits, 0, n));
    }

    private static async ValueTask<SourceColumn> ReadStringsAsync(ParquetReader reader, Stream stream, DataField f, int n, string display, int col)
    {
        var sink = ReadStringPages(reader, stream, f, n, display, col) ?? await ReadStringsRawAsync(reader, f, n, display, col).ConfigureAwait(false);
        var bad = sink.FirstInvalidRow();
        if (bad >= 0) throw LoadThrow.Error(ErrorCodes.Utf8, display, $"column '{f.Name}' holds invalid UTF-8", bad + 1, col);
        return new SourceStrings(f.Name, sink.Build(), nullIsNone: true);
    }

    /// <summary>Our own page decoder (<see cref="ParquetStringChunk"/>); null when a chunk needs Parquet.Net.</summary>
    private static ParquetUtf8Sink? ReadStringPages(ParquetReader reader, Stream stream, DataField f, int n, string display, int col)
    {
        var sink = new ParquetUtf8Sink(n);
        for (var g = 0; g < reader.RowGroupCount; g++)
        {
            using var rg = reader.OpenRowGroupReader(g);
            if (!rg.ColumnExists(f)) return null;
            if (rg.GetMetadata(f) is not { MetaData: { } meta } chunk || !ParquetStringChunk.IsSupported(chunk, f.MaxDefinitionLevel)) return null;
            var outcome = ParquetStringChunk.Read(stream, meta, checked((int)rg.RowCount), f.MaxDefinitionLevel, sink);
            if (outcome == ParquetStringChunk.Outcome.Unsupported) return null;
            if (outcome == ParquetStringChunk.Outcome.TooLarge)
                throw LoadThrow.Error(ErrorCodes.FileRead, display, $"column '{f.Name}' holds more than 2 GiB of text", sink.Rows + 1, col);
        }
        return sink;
    }

    private static async ValueTask<ParquetUtf8Sink> ReadStringsRawAsync(ParquetReader reader, DataField f, int n, string display, int col)
    {
        // A byte[] field with the file's column path makes Parquet.Net hand out raw UTF-8 slices.
        var raw = new DataField<byte[]>(f.Name, f.IsNullable);
        _ = new ParquetSchema(raw);
        var sink = new ParquetUtf8Sink(n);
        // One pair of slice and level arrays for every row group: fresh large arrays are slow to touch.
        ReadOnlyMemory<byte>[] values = [];
        int[] defs = [];
        for (var g = 0; g < reader.RowGroupCount; g++)
        {
            using var rg = reader.OpenRowGroupReader(g);
            var count = checked((int)rg.RowCount);
            if (values.Length < count)
            {
                values = new ReadOnlyMemory<byte>[count];
                defs = new int[count];
            }
            await rg.ReadRawAsync<ReadOnlyMemory<byte>>(raw, values.AsMemory(0, count), defs.AsMemory(0, count), null).ConfigureAwait(false);
            // Copied before the row group reader is disposed: the slices may point into its buffers.
            if (!sink.Add(values, defs, count, f.MaxDefinitionLevel))
                throw LoadThrow.Error(ErrorCodes.FileRead, display, $"column '{f.Name}' holds more than 2 GiB of text", sink.Rows + 1, col);
        }
        return sink;
    }
}
