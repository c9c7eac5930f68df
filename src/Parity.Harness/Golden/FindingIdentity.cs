using System.Globalization;
using Parity.Harness.Findings;

namespace Parity.Harness.Golden;

/// <summary>
/// What makes a finding "the same" across runs: its kind, its place (checkpoint label, or the statement's
/// canonical text and occurrence), its column, the difference itself and the modes compared; never a line
/// number, the count, the message or the samples. The script is implied by the golden folder.
/// </summary>
public static class FindingIdentity
{
    public static string Of(Finding f) =>
        Of(f.KindLabel, f.Checkpoint, f.Statement ?? Parity.Script.Syntax.StatementKeys.Format("line " + f.Line.ToString(CultureInfo.InvariantCulture), 1), f.Column, f.Difference, f.Modes);

    public static string Of(string kind, string? checkpoint, string? statement, string? column, string difference, IReadOnlyList<string> modes) =>
        kind + "\u0001" + (checkpoint is not null ? "checkpoint " + checkpoint : "statement " + statement)
        + "\u0001" + (column ?? "\u0002") + "\u0001" + difference + "\u0001" + string.Join(",", modes);

    /// <summary>
    /// The identity of the first findings format (version 1), which named statements by line: kind, checkpoint
    /// or line, column, modes. Used only to read golden stores written before finding keys lost their lines.
    /// </summary>
    public static string OfVersion1(string kind, int line, string? checkpoint, string? column, IReadOnlyList<string> modes) =>
        kind + "\u0001" + (checkpoint is null ? "line " + line.ToString(CultureInfo.InvariantCulture) : "checkpoint " + checkpoint)
        + "\u0001" + (column ?? "\u0002") + "\u0001" + string.Join(",", modes);
}
