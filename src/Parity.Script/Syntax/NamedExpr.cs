namespace Parity.Script.Syntax;

/// <summary><c>name = EXPR</c> in <c>add</c>, <c>fill</c> (EXPR a literal) and <c>compute</c> (EXPR an aggregate).</summary>
public sealed record NamedExpr(Identifier Name, Expr Value);
