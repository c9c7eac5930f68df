using Parity.Script.Diagnostics;
using Parity.Script.Running;

namespace Parity.Harness.Running;

/// <summary>One script parsed and run in every requested mode (or stopped by parse errors).</summary>
public sealed record ScriptOutcome
{
    /// <summary>The script path relative to the working directory, forward slashes.</summary>
    public required string Script { get; init; }

    /// <summary>Error diagnostics of the parser and checker; when any, the script was not run.</summary>
    public IReadOnlyList<Diagnostic> ParseErrors { get; init; } = [];

    /// <summary>One run per mode, in the order the modes were given.</summary>
    public IReadOnlyList<ModeRun> Runs { get; init; } = [];

    /// <summary>True when the script could not be compared: parse errors, or a run-time error in every mode.</summary>
    public bool IsBadInput => ParseErrors.Count > 0 || FailedInEveryMode;

    public bool FailedInEveryMode
    {
        get
        {
            if (Runs.Count == 0) return false;
            foreach (var r in Runs)
                if (r.Failure is null) return false;
            return true;
        }
    }

    /// <summary>The located messages to print for bad input: parse errors, or each distinct run-time error.</summary>
    public IReadOnlyList<string> BadInputMessages
    {
        get
        {
            var list = new List<string>();
            foreach (var d in ParseErrors) list.Add(d.Format());
            if (ParseErrors.Count == 0 && FailedInEveryMode)
            {
                var distinct = new List<string>();
                foreach (var r in Runs)
                {
                    var plain = r.Failure!.Format();
                    if (!distinct.Contains(plain)) distinct.Add(plain);
                }
                if (distinct.Count == 1) list.Add(distinct[0]);
                else
                    foreach (var r in Runs) list.Add(r.Failure!.Format() + " [" + r.Mode.Name + "]");
            }
            return list;
        }
    }
}
