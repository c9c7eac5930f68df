namespace Parity.Script.Syntax;

public sealed record OrderKey(Identifier Column, bool Descending);
