using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Columns;

/// <summary>UTC instants as microseconds since the Unix epoch; missing shows as <c>NaT</c> under <c>nan</c>.</summary>
public sealed class TimestampColumn : PrimitiveColumn<long>
{
    public TimestampColumn(ReadOnlyMemory<long> values, Validity validity, MissingMarker marker)
        : base(values, validity, marker)
    {
    }

    public override ColumnType Type => ColumnType.Timestamp;

    public override Value GetValue(int index) =>
        Validity.IsValid(index) ? Value.Timestamp(Span[index]) : Value.MissingOf(MissingKindOf);

    protected override PrimitiveColumn<long> With(ReadOnlyMemory<long> values, Validity validity) =>
        new TimestampColumn(values, validity, Marker);
}
