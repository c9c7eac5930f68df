namespace Parity;

/// <summary>A difference between a run and its approved golden snapshot (or a snapshot that is missing).</summary>
/// <param name="Script">The script path relative to the working directory, forward slashes.</param>
/// <param name="Mode">The mode whose result differs.</param>
/// <param name="Checkpoint">The checkpoint label, or null for the statement records and accepted findings.</param>
/// <param name="Message">What differs, as the reports print it.</param>
public sealed record ParityGoldenMismatch(string Script, string Mode, string? Checkpoint, string Message);
