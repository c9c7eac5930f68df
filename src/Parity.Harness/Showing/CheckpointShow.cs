using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Harness.Reports.Internal;
using Parity.Script.Parsing;
using Parity.Script.Running;
using Parity.Script.Syntax;

namespace Parity.Harness.Showing;

/// <summary>
/// The logic of <c>parity show</c>: parse the script, run it in one mode, and pick one checkpoint's frame.
/// A label the script does not have is told apart from a label the mode never reached (it failed earlier),
/// because the fixes differ: a typo versus a run-time error.
/// </summary>
public static class CheckpointShow
{
    /// <param name="scriptText">The script source.</param>
    /// <param name="scriptFile">The script path as printed in diagnostics.</param>
    /// <param name="label">The checkpoint label (ordinal match).</param>
    /// <param name="mode">The mode to run.</param>
    /// <param name="scriptDirectory">Where load paths resolve.</param>
    /// <param name="options">Interpreter settings.</param>
    public static ShowResult Run(string scriptText, string scriptFile, string label, Mode mode, string scriptDirectory, RunOptions options)
    {
        var parsed = ScriptParser.Parse(scriptText, scriptFile);
        var messages = new List<string>();
        foreach (var d in parsed.Diagnostics)
            messages.Add(d.Format());
        if (parsed.HasErrors)
            return new ShowResult(label, mode.Name, null, messages);

        var labels = Labels(parsed.Script);
        if (!labels.Contains(label, StringComparer.Ordinal))
        {
            var list = labels.Count == 0 ? "the script has no checkpoints" : "its checkpoints: " + string.Join(", ", labels.Select(Quote));
            messages.Add(scriptFile + ": error " + ErrorCodes.Usage + ": no checkpoint " + Quote(label) + "; " + list);
            return new ShowResult(label, mode.Name, null, messages);
        }

        // One mode only: no other run will convert the files again, so the loader keeps no parsed copy.
        var run = Interpreter.Run(parsed.Script, mode, scriptDirectory, options with { KeepParsedSources = false });
        var checkpoint = run.FindCheckpoint(label);
        if (checkpoint is null)
        {
            if (run.Failure is { } failure)
                messages.Add(failure.Format());
            messages.Add(scriptFile + ": error " + ErrorCodes.Usage + ": mode " + mode.Name + " stopped before reaching checkpoint " + Quote(label)
                + (run.Failure is null ? " (the run ended without it)" : ""));
            return new ShowResult(label, mode.Name, null, messages);
        }
        return new ShowResult(label, mode.Name, checkpoint.Table, messages);
    }

    /// <summary>The checkpoint labels of a script in order of appearance.</summary>
    public static IReadOnlyList<string> Labels(ScriptNode script)
    {
        var labels = new List<string>();
        foreach (var s in script.Statements)
            if (s is CheckStatement check) labels.Add(check.EffectiveLabel);
        return labels;
    }

    private static string Quote(string s) => "'" + SafeText.Visible(s) + "'";
}
