namespace Parity.Script.Running;

/// <summary>
/// A warning raised in one mode (<c>W-MAYBE-COPY</c>, <c>W-CHAINED-WRITE</c>) with the named frames the
/// write really reached in this mode.
/// </summary>
public sealed record RunWarning(string Code, int Line, int Column, string Message, IReadOnlyList<string> ReachedFrames);
