using Parity.Engine.Errors;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.Kernels;

public sealed class ArithmeticTests
{
    public static TheoryData<string> Modes => new() { "legacy", "modern" };

    // Spec §2.3: '/' is always float64 with IEEE 754 results (IEEE 754 §6.1 / §7.3: x/0 = ±Infinity, 0/0 = NaN).
    [Theory]
    [MemberData(nameof(Modes))]
    public void Division_is_float_with_ieee_results(string m)
    {
        var mode = Mode.Parse(m);
        var r = Arithmetic.Binary(ArithmeticOp.Divide, K.Col(mode, 7, -3, 0, 6), K.Col(mode, 2, 0, 0, 3), mode);
        Assert.Equal("float64", r.TypeLabel);
        Assert.Equal(3.5, r.GetValue(0).Float64);
        Assert.Equal(double.NegativeInfinity, r.GetValue(1).Float64);
        Assert.Equal(2.0, r.GetValue(3).Float64);
        // Spec §2.1: under null a NaN from 0/0 is a value, distinct from null; under nan it is the missing sentinel.
        if (mode.IsNull)
        {
            Assert.False(r.IsMissing(2));
            Assert.True(double.IsNaN(r.GetValue(2).Float64));
        }
        else Assert.Equal(MissingKind.NaN, r.GetValue(2).Missing);
    }

    // Spec §2.3: '%' is floored, the result takes the sign of the divisor.
    [Theory]
    [MemberData(nameof(Modes))]
    public void Modulo_is_floored(string m)
    {
        var mode = Mode.Parse(m);
        var r = Arithmetic.Binary(ArithmeticOp.Modulo, K.Col(mode, -7, 7, 7, -7), K.Col(mode, 3, -3, 3, -3), mode);
        Assert.Equal("int64", r.TypeLabel);
        Assert.Equal([Value.Of(2L), Value.Of(-2L), Value.Of(1L), Value.Of(-1L)], K.Values(r));
        var f = Arithmetic.Binary(ArithmeticOp.Modulo, K.Col(mode, -7.5, 7.5), K.Col(mode, 2.0, -2.0), mode);
        Assert.Equal([Value.Of(0.5), Value.Of(-0.5)], K.Values(f));
    }

    // Spec §2.3: int64 overflow is an error (E-OVERFLOW), never a silent wrap.
    [Theory]
    [InlineData(ArithmeticOp.Add, long.MaxValue, 1L)]
    [InlineData(ArithmeticOp.Subtract, long.MinValue, 1L)]
    [InlineData(ArithmeticOp.Multiply, 4611686018427387904L, 2L)]
    public void Int_overflow_is_an_error(ArithmeticOp op, long a, long b)
    {
        foreach (var mode in new[] { Mode.Legacy, Mode.Modern })
        {
            var e = Assert.Throws<EngineException>(() => Arithmetic.Binary(op, K.Col(mode, 1L, a), K.Col(mode, 1L, b), mode));
            Assert.Equal(ErrorCodes.Overflow, e.Code);
        }
        Assert.Throws<EngineException>(() => Arithmetic.Negate(K.Col(Mode.Modern, long.MinValue), Mode.Modern));
    }

    // Spec §2.3: int and float mix to float64; spec §2.1: a missing operand gives missing (float64 under nan, int64 with nulls under null).
    [Fact]
    public void Mixed_and_missing_operands()
    {
        var mix = Arithmetic.Binary(ArithmeticOp.Add, K.Col(Mode.Modern, 1, 2), K.Col(Mode.Modern, 0.5, 0.25), Mode.Modern);
        Assert.Equal([Value.Of(1.5), Value.Of(2.25)], K.Values(mix));
        var modern = Arithmetic.Binary(ArithmeticOp.Add, K.Col(Mode.Modern, 1, null), K.Col(Mode.Modern, 1, 1), Mode.Modern);
        Assert.Equal("int64", modern.TypeLabel);
        Assert.Equal(MissingKind.Null, modern.GetValue(1).Missing);
        var legacy = Arithmetic.Binary(ArithmeticOp.Add, K.Col(Mode.Legacy, 1, null), K.Col(Mode.Legacy, 1, 1), Mode.Legacy);
        Assert.Equal("float64", legacy.TypeLabel);
        Assert.Equal(MissingKind.NaN, legacy.GetValue(1).Missing);
    }

    // Spec §2.3: round(x, digits) rounds half to even (IEEE 754 roundTiesToEven).
    [Theory]
    [InlineData(2.5, 0, 2.0)]
    [InlineData(3.5, 0, 4.0)]
    [InlineData(-2.5, 0, -2.0)]
    [InlineData(0.125, 2, 0.12)]
    [InlineData(1250.0, -2, 1200.0)]
    public void Round_half_to_even(double x, int digits, double expected)
    {
        foreach (var mode in new[] { Mode.Legacy, Mode.Modern })
        {
            var r = Functions.Round(K.Col(mode, x), K.Col(mode, digits), mode);
            Assert.Equal(expected, r.GetValue(0).Float64);
        }
        var ints = Functions.Round(K.Col(Mode.Modern, 1250L, 1350L, -1250L), K.Col(Mode.Modern, -2, -2, -2), Mode.Modern);
        Assert.Equal([Value.Of(1200L), Value.Of(1400L), Value.Of(-1200L)], K.Values(ints));
    }

    [Fact]
    public void Strings_are_not_numbers()
    {
        var e = Assert.Throws<EngineException>(() => Arithmetic.Binary(ArithmeticOp.Add, K.Col(Mode.Modern, "a"), K.Col(Mode.Modern, 1), Mode.Modern));
        Assert.Equal(ErrorCodes.Type, e.Code);
    }
}
