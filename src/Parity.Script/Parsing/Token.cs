using Parity.Script.Diagnostics;

namespace Parity.Script.Parsing;

/// <summary>
/// One token, pointing into the source: <see cref="Offset"/> and <see cref="Length"/> in UTF-16 units;
/// <see cref="Line"/> and <see cref="Column"/> 0-based, the column in Unicode code points from the line start.
/// </summary>
internal readonly record struct Token(TokenKind Kind, int Offset, int Length, int Line, int Column)
{
    public int End => Offset + Length;

    public SourceSpan Span => new(Offset, Length, Line, Column);

    public ReadOnlySpan<char> Text(string source) => source.AsSpan(Offset, Length);
}
