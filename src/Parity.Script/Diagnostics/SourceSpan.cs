using System.Globalization;

namespace Parity.Script.Diagnostics;

/// <summary>
/// A place in a script. <see cref="Offset"/> and <see cref="Length"/> count UTF-16 units in the source text;
/// <see cref="Line"/> and <see cref="Column"/> are 0-based (column in Unicode code points from the line
/// start) and printed 1-based.
/// </summary>
public readonly record struct SourceSpan(int Offset, int Length, int Line, int Column)
{
    public int LineNumber => Line + 1;

    public int ColumnNumber => Column + 1;

    public override string ToString() =>
        LineNumber.ToString(CultureInfo.InvariantCulture) + ":" + ColumnNumber.ToString(CultureInfo.InvariantCulture);
}
