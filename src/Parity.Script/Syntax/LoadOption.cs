using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>
/// One <c>with (...)</c> option of a load: <c>missing = ['', 'n/a']</c> (a list) or <c>delimiter = ';'</c>.
/// </summary>
public sealed record LoadOption(Identifier Key, IReadOnlyList<LiteralExpr> Values, bool IsList, SourceSpan Span) : Node(Span);
