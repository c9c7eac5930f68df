using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Script.Running.Internal;
using Parity.Script.Syntax;

namespace Parity.Script.Running;

/// <summary>Runs a parsed script in one mode (spec §2, §3).</summary>
public static class Interpreter
{
    /// <summary>
    /// Runs <paramref name="script"/> under <paramref name="mode"/>. Load paths resolve against
    /// <paramref name="scriptDirectory"/>. A run-time error stops the run and is recorded in
    /// <see cref="ModeRun.Failure"/>; it is not thrown.
    /// </summary>
    public static ModeRun Run(ScriptNode script, Mode mode, string scriptDirectory, RunOptions options) =>
        new ScriptRun(script, mode, scriptDirectory, options, null).Execute();

    /// <summary>Runs with frames bound before the first statement (tests and benchmarks: no files needed).</summary>
    internal static ModeRun Run(ScriptNode script, Mode mode, IReadOnlyDictionary<string, Table> frames, RunOptions? options = null) =>
        new ScriptRun(script, mode, Directory.GetCurrentDirectory(), options ?? RunOptions.Default, frames).Execute();
}
