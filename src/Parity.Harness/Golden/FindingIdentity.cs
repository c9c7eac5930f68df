using System.Globalization;
using Parity.Harness.Findings;

namespace Parity.Harness.Golden;

/// <summary>
/// What makes a finding "the same" across runs: its kind, its checkpoint (or, for statement findings, its
/// line), its column and the modes compared; not its count, message or samples. The script is implied by the
/// golden folder.
/// </summary>
public static class FindingIdentity
{
    public static string Of(Finding f) => Of(f.KindLabel, f.Line, f.Checkpoint, f.Column, f.Modes);

    public static string Of(string kind, int line, string? checkpoint, string? column, IReadOnlyList<string> modes) =>
        kind + "\u0001" + (checkpoint is null ? "line " + line.ToString(CultureInfo.InvariantCulture) : "checkpoint " + checkpoint)
        + "\u0001" + (column ?? "\u0002") + "\u0001" + string.Join(",", modes);
}
