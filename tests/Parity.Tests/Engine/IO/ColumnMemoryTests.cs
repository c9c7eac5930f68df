using Apache.Arrow;
using Parity.Engine.Columns;
using Parity.Engine.IO;
using Parity.Engine.Memory;
using Parity.Engine.Modes;

namespace Parity.Tests.Engine.IO;

public sealed class ColumnMemoryTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    // Documented formula (docs/data.md): max(24, round8(20 + 2(n+1))) on 64-bit .NET.
    [Theory]
    [InlineData(0, 24)]
    [InlineData(1, 24)]
    [InlineData(2, 32)]
    [InlineData(20, 64)]
    [InlineData(21, 64)]
    [InlineData(22, 72)]
    public void String_size_formula(int length, long bytes) => Assert.Equal(bytes, ColumnMemory.StringBytes(length));

    // .NET runtime behaviour, measured: GC.GetAllocatedBytesForCurrentThread counts exactly what a string allocation takes.
    [Theory]
    [InlineData(1)]
    [InlineData(5)]
    [InlineData(20)]
    [InlineData(101)]
    public void String_size_matches_the_runtime(int length)
    {
        var chars = new char[length];
        chars.AsSpan().Fill('q');
        var keep = new string[256];
        for (var i = 0; i < keep.Length; i++) keep[i] = new string(chars); // warm up
        var before = GC.GetAllocatedBytesForCurrentThread();
        for (var i = 0; i < keep.Length; i++) keep[i] = new string(chars);
        var after = GC.GetAllocatedBytesForCurrentThread();
        Assert.Equal(ColumnMemory.StringBytes(length) * keep.Length, after - before);
        GC.KeepAlive(keep);
    }

    [Fact]
    public void Boxed_sizes_match_the_runtime()
    {
        var keep = new object[256];
        for (var i = 0; i < keep.Length; i++) keep[i] = (long)i;
        var before = GC.GetAllocatedBytesForCurrentThread();
        for (var i = 0; i < keep.Length; i++) keep[i] = (double)i;
        var mid = GC.GetAllocatedBytesForCurrentThread();
        var refs = new object?[1000];
        var after = GC.GetAllocatedBytesForCurrentThread();
        Assert.Equal(ColumnMemory.BoxedScalarBytes * keep.Length, mid - before);
        Assert.Equal(ColumnMemory.ObjectArrayBytes(1000), after - mid);
        GC.KeepAlive(keep);
        GC.KeepAlive(refs);
    }

    [Fact]
    public void Boxed_column_counts_references_and_each_distinct_object_once()
    {
        var shared = "ab";
        var nan = (object)double.NaN;
        var column = new ObjectColumn(new object?[] { shared, shared, nan, nan, null, 5L }, MissingMarker.Nan);
        // 24 + 6*8 references, "ab" once (32), NaN once (24), boxed long (24); the null costs only its reference.
        Assert.Equal(24 + 48 + 32 + 24 + 24, ColumnMemory.Bytes(column));
    }

    // Apache.Arrow's builders allocate every buffer padded to 64 bytes (Arrow columnar format, "Buffer
    // Alignment and Padding"): our formula must give the same total as the buffers such a builder makes.
    [Theory]
    [InlineData(1, 0, 3)]
    [InlineData(15, 1, 20)]
    [InlineData(100, 0, 20)]
    [InlineData(1000, 37, 7)]
    public void Utf8_formula_matches_apache_arrow_buffers(int count, int nullEvery, int width)
    {
        var builder = new StringArray.Builder();
        var ours = new Utf8ColumnBuilder(count, count * width);
        long data = 0;
        var nulls = 0;
        for (var i = 0; i < count; i++)
        {
            if (nullEvery > 0 && i % (nullEvery + 1) == nullEvery)
            {
                builder.AppendNull();
                ours.AppendMissing();
                nulls++;
                continue;
            }
            var s = new string((char)('a' + i % 26), width);
            builder.Append(s);
            ours.Append(s);
            data += width;
        }
        var array = builder.Build();
        long arrowTotal = array.ValueOffsetsBuffer.Length + array.ValueBuffer.Length + (nulls > 0 ? array.NullBitmapBuffer.Length : 0);
        Assert.Equal(arrowTotal, ColumnMemory.Utf8Bytes(count, nulls, data));
        Assert.Equal(arrowTotal, ColumnMemory.Bytes(ours.Build(MissingMarker.Null)));
    }

    [Fact]
    public void Int64_formula_matches_apache_arrow_buffers()
    {
        var builder = new Int64Array.Builder();
        for (var i = 0; i < 100; i++)
        {
            if (i == 3) builder.AppendNull();
            else builder.Append(i);
        }
        var array = builder.Build();
        var column = DataLoaderColumn("n,k\n" + string.Join("\n", Enumerable.Range(0, 100).Select(i => (i == 3 ? "" : i.ToString(System.Globalization.CultureInfo.InvariantCulture)) + ",0")) + "\n", Mode.Modern);
        Assert.Equal(array.ValueBuffer.Length + array.NullBitmapBuffer.Length, ColumnMemory.Bytes(column));
    }

    [Fact]
    public void Legacy_string_column_bytes_are_references_plus_strings()
    {
        var column = DataLoaderColumn("s,k\nab,0\n,1\nabc,2\n", Mode.Legacy);
        // 24 + 3 refs; "ab" 32, "abc" 32; the missing cell is the shared boxed NaN (24).
        Assert.Equal(24 + 24 + 32 + 32 + 24, ColumnMemory.Bytes(column));
    }

    private Parity.Engine.Columns.Column DataLoaderColumn(string csv, Mode mode) =>
        DataLoader.Load(_files.Write("m" + Guid.NewGuid().ToString("N") + ".csv", csv), LoadOptions.Default, mode).Columns[0];
}
