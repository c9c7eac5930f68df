using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.Kernels;

public sealed class ComparisonLogicTests
{
    // Spec §2.2: with a missing operand, under nan = < <= > >= are false and <> is true; under null all are null.
    [Theory]
    [InlineData(ComparisonOp.Equal)]
    [InlineData(ComparisonOp.NotEqual)]
    [InlineData(ComparisonOp.Less)]
    [InlineData(ComparisonOp.LessOrEqual)]
    [InlineData(ComparisonOp.Greater)]
    [InlineData(ComparisonOp.GreaterOrEqual)]
    public void Missing_operand(ComparisonOp op)
    {
        foreach (var mode in new[] { Mode.Legacy, K.ArrowNan })
        {
            var r = Comparison.Compare(op, K.Col(mode, 1.0, null), K.Col(mode, 1.0, 1.0), mode);
            Assert.Equal("bool", r.TypeLabel);
            Assert.Equal(Value.Of(op == ComparisonOp.NotEqual), r.GetValue(1));
            var s = Comparison.Compare(op, K.Col(mode, "a", null), K.Col(mode, "a", "a"), mode);
            Assert.Equal(Value.Of(op == ComparisonOp.NotEqual), s.GetValue(1));
        }
        foreach (var mode in new[] { Mode.Modern, K.BoxedNull })
        {
            var r = Comparison.Compare(op, K.Col(mode, 1, null), K.Col(mode, 1, 1), mode);
            Assert.Equal(MissingKind.Null, r.GetValue(1).Missing);
            var s = Comparison.Compare(op, K.Col(mode, "a", null), K.Col(mode, "a", "a"), mode);
            Assert.Equal(MissingKind.Null, s.GetValue(1).Missing);
        }
    }

    // IEEE 754 §5.11: NaN is unordered: every comparison is false except "not equal". Spec §2.1: under null a NaN is a value.
    [Fact]
    public void Nan_value_is_unordered_under_null()
    {
        var mode = Mode.Modern;
        var nan = Arithmetic.Binary(ArithmeticOp.Divide, K.Col(mode, 0.0), K.Col(mode, 0.0), mode);
        Assert.Equal(Value.Of(false), Comparison.Compare(ComparisonOp.Equal, nan, nan, mode).GetValue(0));
        Assert.Equal(Value.Of(true), Comparison.Compare(ComparisonOp.NotEqual, nan, nan, mode).GetValue(0));
        Assert.Equal(Value.Of(false), Comparison.Compare(ComparisonOp.Less, nan, K.Col(mode, 1.0), mode).GetValue(0));
    }

    // Spec §2.2 "Ordering": code point order; Unicode Standard §5.17 "Binary Order": UTF-16 order puts U+FFFD after U+1F6A2 (a surrogate pair), code point order before.
    [Fact]
    public void Strings_compare_in_code_point_order_on_both_storages()
    {
        foreach (var mode in new[] { Mode.Legacy, Mode.Modern })
        {
            var r = Comparison.Compare(ComparisonOp.Less, K.Col(mode, "\uFFFD", "a"), K.Col(mode, "\U0001F6A2", "b"), mode);
            Assert.Equal([Value.Of(true), Value.Of(true)], K.Values(r));
        }
        Assert.True(string.CompareOrdinal("\uFFFD", "\U0001F6A2") > 0); // .NET ordinal (UTF-16) order disagrees
    }

    // SQL three-valued logic (ISO/IEC 9075, Kleene): truth tables for and/or/not with null. Spec §2.2.
    [Theory]
    [InlineData(true, true, true, true)]
    [InlineData(true, false, false, true)]
    [InlineData(true, null, null, true)]
    [InlineData(false, null, false, null)]
    [InlineData(null, null, null, null)]
    [InlineData(false, false, false, false)]
    public void Kleene_under_null(bool? a, bool? b, bool? and, bool? or)
    {
        var mode = Mode.Modern;
        var x = K.Col(mode, a);
        var y = K.Col(mode, b);
        Assert.Equal(Expect(and), Logic.And(x, y, mode).GetValue(0));
        Assert.Equal(Expect(and), Logic.And(y, x, mode).GetValue(0));
        Assert.Equal(Expect(or), Logic.Or(x, y, mode).GetValue(0));
        Assert.Equal(Expect(or), Logic.Or(y, x, mode).GetValue(0));
        Assert.Equal(Expect(a is null ? null : !a), Logic.Not(x, mode).GetValue(0));
    }

    private static Value Expect(bool? v) => v is null ? Value.Null : Value.Of(v.Value);

    // Spec §2.2: under nan a missing operand counts as false.
    [Fact]
    public void Missing_counts_as_false_under_nan()
    {
        var mode = Mode.Legacy;
        var missing = new ObjectColumn(new object?[] { double.NaN }, MissingMarker.Nan); // a bool column with a missing cell
        var t = K.Col(mode, true);
        Assert.Equal(Value.Of(false), Logic.And(missing, t, mode).GetValue(0));
        Assert.Equal(Value.Of(true), Logic.Or(missing, t, mode).GetValue(0));
        Assert.Equal(Value.Of(true), Logic.Not(missing, mode).GetValue(0));
        Assert.Equal("bool", Logic.Or(missing, t, mode).TypeLabel);
    }

    // Spec §3.4: 'is null' is true for any kind of missing value in any mode.
    [Fact]
    public void Is_null_sees_every_marker()
    {
        var cells = new ObjectColumn(new object?[] { null, double.NaN, "x" }, MissingMarker.Nan);
        Assert.Equal([Value.Of(true), Value.Of(true), Value.Of(false)], K.Values(Logic.IsMissing(cells, false, Mode.Legacy)));
        Assert.Equal([Value.Of(false), Value.Of(true)], K.Values(Logic.IsMissing(K.Col(Mode.Modern, 1, null), false, Mode.Modern)));
    }

    // Spec §2.2: an object mask holding a missing value cannot filter under nan (E-MASK-MISSING); a null condition drops the row and is counted.
    [Fact]
    public void Masks()
    {
        var legacy = new ObjectColumn(new object?[] { true, double.NaN }, MissingMarker.Nan);
        Assert.Equal(ErrorCodes.MaskMissing, Assert.Throws<EngineException>(() => global::Parity.Engine.Kernels.Masks.Select(legacy, Mode.Legacy, out _)).Code);
        var keep = global::Parity.Engine.Kernels.Masks.Select(Comparison.Compare(ComparisonOp.Greater, K.Col(Mode.Modern, 5, null, 1), K.Col(Mode.Modern, 2, 2, 2), Mode.Modern), Mode.Modern, out var nulls);
        Assert.Equal([true, false, false], keep);
        Assert.Equal(1, nulls);
    }
}
