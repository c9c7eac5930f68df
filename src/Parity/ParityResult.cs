namespace Parity;

/// <summary>
/// What a run or check found: per script the cross-mode findings with their status, the golden mismatches
/// (check only), every checkpoint's frame in every mode, and the text the <c>parity</c> command prints.
/// </summary>
public sealed class ParityResult
{
    internal ParityResult(string command, bool passed, string text, IReadOnlyList<string> scripts, IReadOnlyList<ParityFinding> findings,
        IReadOnlyList<ParityGoldenMismatch> goldenMismatches, IReadOnlyList<ParityCheckpoint> checkpoints)
    {
        Command = command;
        Passed = passed;
        Text = text;
        Scripts = scripts;
        Findings = findings;
        GoldenMismatches = goldenMismatches;
        Checkpoints = checkpoints;
    }

    /// <summary><c>run</c> or <c>check</c>: what was done.</summary>
    public string Command { get; }

    /// <summary>
    /// True when the gate passes: no finding is <c>new</c> or <c>changed</c> and (check) every mode equals its
    /// golden snapshot. <c>parity</c> exits 0 exactly then.
    /// </summary>
    public bool Passed { get; }

    /// <summary>The terminal summary, as <c>parity run</c> or <c>parity check</c> prints it to a log (no colour).</summary>
    public string Text { get; }

    /// <summary>The scripts run, relative to the working directory, forward slashes.</summary>
    public IReadOnlyList<string> Scripts { get; }

    /// <summary>The cross-mode findings of every script, in report order, including resolved ones.</summary>
    public IReadOnlyList<ParityFinding> Findings { get; }

    /// <summary>Differences from the golden snapshots; empty for a run.</summary>
    public IReadOnlyList<ParityGoldenMismatch> GoldenMismatches { get; }

    /// <summary>Every checkpoint each mode reached, by script, then mode in the order given, then script order.</summary>
    public IReadOnlyList<ParityCheckpoint> Checkpoints { get; }

    /// <summary>
    /// The checkpoint labelled <paramref name="label"/> in <paramref name="mode"/> (of the first script that has
    /// it); throws <see cref="KeyNotFoundException"/> naming the labels there are when there is none.
    /// </summary>
    public ParityCheckpoint Checkpoint(string label, string mode = "modern")
    {
        var labels = new List<string>();
        foreach (var c in Checkpoints)
        {
            if (string.Equals(c.Label, label, StringComparison.Ordinal) && string.Equals(c.Mode, mode, StringComparison.Ordinal)) return c;
            if (!labels.Contains(c.Label)) labels.Add(c.Label);
        }
        throw new KeyNotFoundException("no checkpoint '" + label + "' in mode " + mode + "; checkpoints: " + string.Join(", ", labels));
    }

    /// <inheritdoc/>
    public override string ToString() => Text;
}
