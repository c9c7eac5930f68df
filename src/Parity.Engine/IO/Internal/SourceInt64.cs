using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Engine.IO.Internal;

/// <summary>Integers; under <c>nan</c> a column with missing cells becomes float64 with NaN (spec §2.1).</summary>
internal sealed class SourceInt64(string name, ReadOnlyMemory<long> values, Validity validity) : SourceColumn(name, values.Length)
{
    private readonly bool _hasMissing = validity.NullCount > 0;

    public override Column ToColumn(Mode mode)
    {
        if (mode.IsNull) return new Int64Column(values, _hasMissing ? validity : Validity.AllValid(Length), MissingMarker.Null);
        if (!_hasMissing) return new Int64Column(values, Validity.AllValid(Length), MissingMarker.Nan);
        var src = values.Span;
        var data = new double[src.Length];
        for (var i = 0; i < data.Length; i++) data[i] = validity.IsValid(i) ? src[i] : double.NaN;
        return new Float64Column(data, MissingMarker.Nan);
    }

    public override SourceColumn Take(int[] rows) => new SourceInt64(Name, TakeValues(values.Span, rows), TakeValidity(validity, rows));
}
