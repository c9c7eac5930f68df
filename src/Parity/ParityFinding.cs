namespace Parity;

/// <summary>
/// A group of differences between modes at one place of a script, as every report shows it: the kind, where
/// it is, how many cells or rows it covers, and how it stands against the accepted findings in the golden store.
/// </summary>
/// <param name="Kind">One of <c>shape</c>, <c>type</c>, <c>value</c>, <c>missing</c>, <c>alias</c>, <c>warning</c>, <c>error</c>.</param>
/// <param name="Status"><c>new</c> or <c>changed</c> (these fail the gate), <c>accepted</c> or <c>resolved</c>.</param>
/// <param name="Script">The script path relative to the working directory, forward slashes.</param>
/// <param name="Line">The 1-based line of the checkpoint or statement.</param>
/// <param name="Checkpoint">The checkpoint label, or null for a finding about a statement.</param>
/// <param name="Column">The column, or null for a finding about a whole frame or statement.</param>
/// <param name="Count">How many differences the finding groups.</param>
/// <param name="Message">The one-line description the reports print.</param>
/// <param name="Hint">The one-line migration hint.</param>
public sealed record ParityFinding(string Kind, string Status, string Script, int Line, string? Checkpoint, string? Column, int Count, string Message, string Hint);
