namespace Parity.Engine.Files;

/// <summary>What a read through <see cref="SafeFile"/> must satisfy, and how its errors are worded.</summary>
public sealed record FileReadRules
{
    /// <summary>The path as the user wrote it, for messages (escaped before it is printed).</summary>
    public required string Display { get; init; }

    /// <summary>When set, the file's real path must lie inside this folder's real path (else <c>E-PATH</c>).</summary>
    public string? Root { get; init; }

    /// <summary>The root as the user knows it, for messages; defaults to the root's full path.</summary>
    public string? RootDisplay { get; init; }

    /// <summary>What the message tells the user to do about a path outside the root.</summary>
    public string OutsideHint { get; init; } = "";

    /// <summary>Files above this many bytes are refused with <see cref="SizeCode"/> before anything is read.</summary>
    public long MaxBytes { get; init; } = long.MaxValue;

    /// <summary>The code of a file above <see cref="MaxBytes"/>.</summary>
    public string SizeCode { get; init; } = Errors.ErrorCodes.Limit;

    /// <summary>What the size limit is called in the message (an option, or a fixed cap).</summary>
    public string SizeHint { get; init; } = "";
}
