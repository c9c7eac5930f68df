using System.Globalization;
using Parity.Harness.Formatting;

namespace Parity.Harness.Gate;

/// <summary>One script whose golden snapshot <see cref="GateSession.Accept"/> wrote or refreshed.</summary>
/// <param name="Script">The script path relative to the working directory, forward slashes.</param>
/// <param name="Checkpoint">The one checkpoint refreshed, or null when the whole snapshot was written.</param>
/// <param name="Checkpoints">The most checkpoints any mode reached.</param>
/// <param name="Modes">The number of modes run.</param>
/// <param name="Findings">The cross-mode findings accepted.</param>
/// <param name="Folder">The script's golden folder as the user would write it (<c>golden/refunds</c>).</param>
public sealed record AcceptedScript(string Script, string? Checkpoint, int Checkpoints, int Modes, int Findings, string Folder)
{
    /// <summary>The line <c>parity accept</c> prints: <c>accepted SCRIPT: N checkpoints in M modes, K findings -> FOLDER</c>.</summary>
    public string Describe() =>
        "accepted " + CellText.Safe(Script)
        + (Checkpoint is null ? "" : " checkpoint " + CellText.Quote(Checkpoint))
        + ": " + Count(Checkpoints, "checkpoint") + " in " + Count(Modes, "mode") + ", " + Count(Findings, "finding")
        + " -> " + Folder;

    private static string Count(int n, string noun) => n.ToString(CultureInfo.InvariantCulture) + " " + noun + (n == 1 ? "" : "s");
}
