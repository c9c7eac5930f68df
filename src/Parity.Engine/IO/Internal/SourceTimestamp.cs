using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Engine.IO.Internal;

/// <summary>UTC microseconds since the epoch; missing keeps its validity bit in every mode (shown NaT under <c>nan</c>).</summary>
internal sealed class SourceTimestamp(string name, ReadOnlyMemory<long> values, Validity validity) : SourceColumn(name, values.Length)
{
    public override Column ToColumn(Mode mode) =>
        new TimestampColumn(values, validity.NullCount > 0 ? validity : Validity.AllValid(Length), mode.Missing);

    public override SourceColumn Take(int[] rows) => new SourceTimestamp(Name, TakeValues(values.Span, rows), TakeValidity(validity, rows));
}
