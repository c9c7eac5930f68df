using Parity.Engine.Frames;

namespace Parity.Script.Running;

/// <summary>A checkpoint reached in one mode: its label, where it stands, and the frame as it was then.</summary>
public sealed record CheckpointResult(string Label, string FrameName, int Line, int Column, Table Table)
{
    /// <summary>The key columns the script names for this checkpoint (<c>check F key c1, c2</c>); empty when none.</summary>
    public IReadOnlyList<string> Keys { get; init; } = [];
}
