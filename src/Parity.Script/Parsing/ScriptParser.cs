using Parity.Script.Checking;
using Parity.Script.Diagnostics;

namespace Parity.Script.Parsing;

/// <summary>Parses <c>.parity</c> script text (spec §3) and checks it statically.</summary>
public static class ScriptParser
{
    /// <summary>
    /// Parses and statically checks a script; <paramref name="file"/> is the name printed in diagnostics.
    /// Never throws for any input text: every problem is a located diagnostic, sorted by position. Statements
    /// with a syntax error are left out of the tree; the others are kept, so the tree is useful for tooling
    /// even when <see cref="ParseResult.HasErrors"/> is true (the runner must not run such a script).
    /// </summary>
    public static ParseResult Parse(string text, string file)
    {
        ArgumentNullException.ThrowIfNull(text);
        ArgumentNullException.ThrowIfNull(file);
        var diagnostics = new List<Diagnostic>();
        var script = Parser.Parse(text, file, diagnostics, out var brokenDefinitions);
        ScriptChecker.Check(script, diagnostics, brokenDefinitions);
        // Stable sort: diagnostics at one position keep the order they were found in.
        var sorted = diagnostics.OrderBy(d => d.Span.Offset).ToArray();
        return new ParseResult(script, sorted);
    }
}
