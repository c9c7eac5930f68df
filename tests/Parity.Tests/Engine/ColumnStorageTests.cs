using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine;

public sealed class ColumnStorageTests
{
    [Fact]
    public void Validity_bits_are_least_significant_bit_first()
    {
        // Apache Arrow columnar format, "Validity bitmaps": slot j is bit (j % 8) of byte (j / 8), LSB first.
        var v = Validity.FromFlags([true, false, true, true, false, false, false, false, true]);
        Assert.Equal(0b0000_1101, v.Bits.Span[0]);
        Assert.Equal(0b0000_0001, v.Bits.Span[1]);
        Assert.Equal(5, v.NullCount);
        Assert.False(v.Slice(1, 3).IsValid(0));
        Assert.Equal(1, v.Slice(1, 3).NullCount);
    }

    [Fact]
    public void Utf8_builder_writes_arrow_offsets_data_and_validity()
    {
        // Apache Arrow columnar format, "Variable-size Binary Layout": n+1 int32 offsets, monotonic,
        // a null slot has equal consecutive offsets; Apache.Arrow's StringArray reads the same buffers.
        var b = new Utf8ColumnBuilder(2, 4);
        b.Append("Åsa");
        b.AppendMissing();
        b.Append("😀");
        b.Append("");
        var col = b.Build(MissingMarker.Null);
        Assert.Equal(4, col.Length);
        Assert.Equal([0, 4, 4, 8, 8], col.Offsets.ToArray());
        Assert.Equal(1, col.Array.NullCount);
        Assert.True(col.IsMissing(1));
        Assert.False(col.IsMissing(3));
        Assert.Equal("😀", col.GetString(2));
        Assert.Equal(Value.Null, col.GetValue(1));
    }

    [Fact]
    public void Utf8_slice_keeps_absolute_offsets_and_clone_rebases_them()
    {
        // Apache.Arrow behaviour: a sliced array's ValueOffsets are absolute into the shared data buffer.
        var col = (Utf8Column)ColumnFactory.FromValues([Value.Of("ab"), Value.Of("cde"), Value.Of("f")], Mode.Modern);
        var slice = (Utf8Column)col.Slice(1, 2);
        Assert.Equal([2, 5, 6], slice.Offsets.ToArray());
        Assert.Equal("cde", slice.GetString(0));
        var clone = (Utf8Column)slice.Clone();
        Assert.Equal([0, 3, 4], clone.Offsets.ToArray());
        Assert.Equal("f", clone.GetString(1));
    }

    // Spec §2.1: integers with missing are float64 under nan and int64 with nulls under null;
    // booleans with missing are object under nan and bool with nulls under null.
    [Theory]
    [InlineData("legacy", "float64", "object", "object")]
    [InlineData("modern", "int64", "bool", "utf8")]
    [InlineData("arrow+nan+cow", "float64", "object", "utf8")]
    [InlineData("boxed+null+alias", "int64", "bool", "object")]
    public void Types_with_missing_follow_the_mode(string modeText, string ints, string bools, string strings)
    {
        var mode = Mode.Parse(modeText);
        Assert.Equal(ints, ColumnFactory.FromValues([Value.Of(1L), Value.Null], mode).TypeLabel);
        Assert.Equal(bools, ColumnFactory.FromValues([Value.Of(true), Value.Null], mode).TypeLabel);
        Assert.Equal(strings, ColumnFactory.FromValues([Value.Of("a"), Value.Null], mode).TypeLabel);
        Assert.Equal("int64", ColumnFactory.FromValues([Value.Of(1L), Value.Of(2L)], mode).TypeLabel);
    }

    [Fact]
    public void Nan_in_a_float_column_is_missing_under_nan_and_a_value_under_null()
    {
        // Spec §2.1: under null a NaN produced by arithmetic stays a NaN value, distinct from null.
        var legacy = new Float64Column([double.NaN, 1.0], MissingMarker.Nan);
        var modern = new Float64Column([double.NaN, 1.0], MissingMarker.Null);
        Assert.True(legacy.IsMissing(0));
        Assert.Equal(Value.NaN, legacy.GetValue(0));
        Assert.False(modern.IsMissing(0));
        Assert.True(double.IsNaN(modern.GetValue(0).Float64));
    }

    [Fact]
    public void Boxed_cells_keep_none_apart_from_nan_under_nan()
    {
        // Spec §2.2: only boxed+nan keeps None apart from NaN.
        var col = ColumnFactory.FromValues([Value.Of("a"), Value.NoneRef, Value.NaN], Mode.Legacy);
        Assert.Equal(Value.NoneRef, col.GetValue(1));
        Assert.Equal(Value.NaN, col.GetValue(2));
        var arrowNan = ColumnFactory.FromValues([Value.Of("a"), Value.NoneRef, Value.NaN], Mode.Parse("arrow+nan+alias"));
        Assert.Equal(Value.NaN, arrowNan.GetValue(1));
        Assert.Equal(Value.NaN, arrowNan.GetValue(2));
    }

    [Fact]
    public void Mixed_values_are_object_under_boxed_and_an_error_under_arrow()
    {
        // Spec §2: an Arrow string column holds only strings or missing.
        Assert.Equal("object", ColumnFactory.FromValues([Value.Of("a"), Value.Of(1L)], Mode.Legacy).TypeLabel);
        var ex = Assert.Throws<Parity.Engine.Errors.EngineException>(() => ColumnFactory.FromValues([Value.Of("a"), Value.Of(1L)], Mode.Modern));
        Assert.Equal("E-TYPE", ex.Code);
    }

    [Fact]
    public void Gather_with_minus_one_gives_missing()
    {
        var col = new Int64Column([10L, 20L, 30L], MissingMarker.Null);
        var g = col.Gather([2, -1, 0]);
        Assert.Equal(Value.Of(30L), g.GetValue(0));
        Assert.Equal(Value.Null, g.GetValue(1));
        Assert.Equal("float64", ColumnFactory.Normalize(new Int64Column([1L, 2L], MissingMarker.Nan).Gather([0, -1]), Mode.Legacy).TypeLabel);
    }
}
