using Parity.Script.Diagnostics;

namespace Parity.Script.Syntax;

/// <summary>A function or aggregate call; <see cref="Function"/> keeps the name as written (matched case-insensitively).</summary>
public sealed record CallExpr(Identifier Function, IReadOnlyList<Expr> Args, SourceSpan Span) : Expr(Span);
