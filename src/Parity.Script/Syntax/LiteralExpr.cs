using Parity.Engine.Values;
using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>
/// <c>42</c>, <c>3.5</c>, <c>'text'</c>, <c>true</c>, <c>false</c>, <c>null</c>. The <c>null</c> literal is a
/// <see cref="Value"/> of kind Missing with <see cref="MissingKind.Null"/>; each mode maps it to its marker.
/// </summary>
public sealed record LiteralExpr(Value Value, SourceSpan Span) : Expr(Span)
{
    public bool IsNull => Value.IsMissing;
}
