using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Columns;

/// <summary>Booleans, one byte each. Under <c>nan</c> modes it never holds a missing cell (that makes it object).</summary>
public sealed class BoolColumn : PrimitiveColumn<bool>
{
    public BoolColumn(ReadOnlyMemory<bool> values, Validity validity, MissingMarker marker)
        : base(values, validity, marker)
    {
    }

    public BoolColumn(bool[] values, MissingMarker marker)
        : base(values, Validity.AllValid(values.Length), marker)
    {
    }

    public override ColumnType Type => ColumnType.Bool;

    public override Value GetValue(int index) =>
        Validity.IsValid(index) ? Value.Of(Span[index]) : Value.MissingOf(MissingKindOf);

    protected override PrimitiveColumn<bool> With(ReadOnlyMemory<bool> values, Validity validity) =>
        new BoolColumn(values, validity, Marker);
}
