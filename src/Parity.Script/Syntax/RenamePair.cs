namespace Parity.Script.Syntax;

public sealed record RenamePair(Identifier From, Identifier To);
