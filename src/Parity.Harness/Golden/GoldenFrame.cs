using Parity.Engine.Values;

namespace Parity.Harness.Golden;

/// <summary>
/// A checkpoint frame as a golden file holds it: header, then either every row inline or (above the row
/// limit) a summary, a content hash and the name of the Arrow IPC file with the data.
/// </summary>
public sealed record GoldenFrame
{
    public required string Label { get; init; }

    public required string Mode { get; init; }

    public required int Rows { get; init; }

    public required IReadOnlyList<GoldenColumn> Columns { get; init; }

    /// <summary>Every row when inline; null when the data lives in <see cref="ArrowFile"/>.</summary>
    public IReadOnlyList<Value[]>? Data { get; init; }

    public string? ArrowFile { get; init; }

    /// <summary>SHA-256 (lower-case hex) of the canonical encoding, see <see cref="GoldenFrameText.ContentHash"/>.</summary>
    public string? Sha256 { get; init; }

    public IReadOnlyList<GoldenMissingCount> Missing { get; init; } = [];

    public IReadOnlyList<Value[]> Preview { get; init; } = [];
}
