using Parity.Engine.Modes;
using Parity.Script.Syntax;

namespace Parity.Script.Running;

/// <summary>Runs a parsed script in one mode. PENDING: the language issue replaces this body.</summary>
public static class Interpreter
{
    /// <summary>
    /// Runs <paramref name="script"/> under <paramref name="mode"/>. Load paths resolve against
    /// <paramref name="scriptDirectory"/>. A run-time error stops the run and is recorded in
    /// <see cref="ModeRun.Failure"/>; it is not thrown.
    /// </summary>
    public static ModeRun Run(ScriptNode script, Mode mode, string scriptDirectory, RunOptions options) =>
        throw new NotImplementedException("pending: interpreter");
}
