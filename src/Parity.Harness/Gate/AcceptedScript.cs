namespace Parity.Harness.Gate;

/// <summary>One script whose golden snapshot <see cref="GateSession.Accept"/> wrote or refreshed.</summary>
/// <param name="Script">The script path relative to the working directory, forward slashes.</param>
/// <param name="Checkpoint">The one checkpoint refreshed, or null when the whole snapshot was written.</param>
/// <param name="Checkpoints">The most checkpoints any mode reached.</param>
/// <param name="Modes">The number of modes run.</param>
/// <param name="Findings">The cross-mode findings accepted.</param>
/// <param name="Folder">The script's golden folder as the user would write it (<c>golden/refunds</c>).</param>
public sealed record AcceptedScript(string Script, string? Checkpoint, int Checkpoints, int Modes, int Findings, string Folder);
