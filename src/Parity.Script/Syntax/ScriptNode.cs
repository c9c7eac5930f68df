namespace Parity.Script.Syntax;

/// <summary>A parsed script: its statements in order and the file it came from.</summary>
public sealed record ScriptNode(string File, IReadOnlyList<Statement> Statements);
