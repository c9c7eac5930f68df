using Parity.Harness.Findings;

namespace Parity.Harness.Shrinking;

/// <summary>The outcome of <see cref="Shrinker.Run"/>: the reduced fixture, and how far the reduction got.</summary>
public sealed record ShrinkResult
{
    /// <summary>Full path of the reduced script.</summary>
    public required string ScriptOut { get; init; }

    public required IReadOnlyList<ShrunkFile> Files { get; init; }

    /// <summary>The finding as it appears on the reduced fixture (checked by running the written files).</summary>
    public required Finding Finding { get; init; }

    /// <summary>
    /// True when the written files were run again from disk and showed the finding; false only when the time
    /// bound had passed before that check (the attempts that kept the finding ran on the same tables).
    /// </summary>
    public required bool Verified { get; init; }

    /// <summary>Runs of the two modes on candidate fixtures (the first run on the original data not counted).</summary>
    public required int Attempts { get; init; }

    /// <summary>True when the time bound ended the reduction; the fixture keeps the finding but may not be minimal.</summary>
    public required bool StoppedByTimeLimit { get; init; }

    /// <summary>True when removing any one remaining row (of any file) was tried and lost the finding.</summary>
    public bool OneMinimal => !StoppedByTimeLimit;

    public required TimeSpan Elapsed { get; init; }
}
