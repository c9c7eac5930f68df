namespace Parity.Script.Parsing;

/// <summary>Parses <c>.parity</c> script text (spec §3). PENDING: the language issue replaces this body.</summary>
public static class ScriptParser
{
    /// <summary>Parses and statically checks a script; <paramref name="file"/> is the name printed in diagnostics.</summary>
    public static ParseResult Parse(string text, string file) => throw new NotImplementedException("pending: parser");
}
