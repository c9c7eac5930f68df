using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// Doubles. Under <c>null</c> missing is the validity bitmap (a NaN value stays a value); under <c>nan</c>
/// missing slots hold NaN and no bitmap is kept (spec §2.1).
/// </summary>
internal sealed class SourceFloat64(string name, ReadOnlyMemory<double> values, Validity validity) : SourceColumn(name, values.Length)
{
    private readonly bool _hasMissing = validity.NullCount > 0;

    public override Column ToColumn(Mode mode)
    {
        if (!_hasMissing) return new Float64Column(values, Validity.AllValid(Length), mode.Missing);
        if (mode.IsNull) return new Float64Column(values, validity, MissingMarker.Null);
        var src = values.Span;
        var data = new double[src.Length];
        for (var i = 0; i < data.Length; i++) data[i] = validity.IsValid(i) ? src[i] : double.NaN;
        return new Float64Column(data, MissingMarker.Nan);
    }

    public override SourceColumn Take(int[] rows) => new SourceFloat64(Name, TakeValues(values.Span, rows), TakeValidity(validity, rows));
}
