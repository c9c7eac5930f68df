using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Parsing;

/// <summary>A parsed script and every diagnostic found (the parser recovers at the next statement).</summary>
public sealed record ParseResult(ScriptNode Script, IReadOnlyList<Diagnostic> Diagnostics)
{
    public bool HasErrors
    {
        get
        {
            foreach (var d in Diagnostics)
                if (d.Severity == Severity.Error) return true;
            return false;
        }
    }
}
