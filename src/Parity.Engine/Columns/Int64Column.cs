using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Columns;

/// <summary>64-bit integers. Under <c>nan</c> modes it never holds a missing cell (that makes it float64).</summary>
public sealed class Int64Column : PrimitiveColumn<long>
{
    public Int64Column(ReadOnlyMemory<long> values, Validity validity, MissingMarker marker)
        : base(values, validity, marker)
    {
    }

    public Int64Column(long[] values, MissingMarker marker)
        : base(values, Validity.AllValid(values.Length), marker)
    {
    }

    public override ColumnType Type => ColumnType.Int64;

    public override Value GetValue(int index) =>
        Validity.IsValid(index) ? Value.Of(Span[index]) : Value.MissingOf(MissingKindOf);

    protected override PrimitiveColumn<long> With(ReadOnlyMemory<long> values, Validity validity) =>
        new Int64Column(values, validity, Marker);
}
