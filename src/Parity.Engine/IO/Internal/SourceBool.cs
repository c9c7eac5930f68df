using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Engine.IO.Internal;

/// <summary>Booleans; under <c>nan</c> a column with missing cells becomes object: boxed bools and NaN (spec §2.1).</summary>
internal sealed class SourceBool(string name, ReadOnlyMemory<bool> values, Validity validity) : SourceColumn(name, values.Length)
{
    private readonly bool _hasMissing = validity.NullCount > 0;

    public override Column ToColumn(Mode mode)
    {
        if (!_hasMissing) return new BoolColumn(values, Validity.AllValid(Length), mode.Missing);
        if (mode.IsNull) return new BoolColumn(values, validity, MissingMarker.Null);
        var src = values.Span;
        var cells = new object?[src.Length];
        for (var i = 0; i < cells.Length; i++)
            cells[i] = !validity.IsValid(i) ? SharedBoxes.NaN : src[i] ? SharedBoxes.True : SharedBoxes.False;
        return new ObjectColumn(cells, MissingMarker.Nan);
    }

    public override SourceColumn Take(int[] rows) => new SourceBool(Name, TakeValues(values.Span, rows), TakeValidity(validity, rows));
}
