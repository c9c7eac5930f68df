using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Columns;

/// <summary>
/// IEEE 754 doubles. Under <c>nan</c> a NaN value is the missing sentinel; under <c>null</c> missing is the
/// validity bitmap and a NaN produced by arithmetic stays a value (spec §2.1).
/// </summary>
public sealed class Float64Column : PrimitiveColumn<double>
{
    public Float64Column(ReadOnlyMemory<double> values, Validity validity, MissingMarker marker)
        : base(values, validity, marker)
    {
    }

    public Float64Column(double[] values, MissingMarker marker)
        : base(values, Validity.AllValid(values.Length), marker)
    {
    }

    public override ColumnType Type => ColumnType.Float64;

    public override bool IsMissing(int index) =>
        !Validity.IsValid(index) || (Marker == MissingMarker.Nan && double.IsNaN(Span[index]));

    public override int MissingCount
    {
        get
        {
            if (Marker == MissingMarker.Null) return Validity.NullCount;
            var n = 0;
            var span = Span;
            for (var i = 0; i < span.Length; i++)
                if (double.IsNaN(span[i]) || !Validity.IsValid(i)) n++;
            return n;
        }
    }

    public override Value GetValue(int index)
    {
        if (!Validity.IsValid(index)) return Value.MissingOf(MissingKindOf);
        var d = Span[index];
        return Marker == MissingMarker.Nan && double.IsNaN(d) ? Value.NaN : Value.Of(d);
    }

    protected override PrimitiveColumn<double> With(ReadOnlyMemory<double> values, Validity validity) =>
        new Float64Column(values, validity, Marker);
}
