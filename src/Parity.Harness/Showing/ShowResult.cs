using Parity.Engine.Frames;

namespace Parity.Harness.Showing;

/// <summary>
/// What <c>show</c> found: the checkpoint's frame (null on failure), and the lines for stderr: every
/// diagnostic on failure, warnings otherwise.
/// </summary>
public sealed record ShowResult(string Label, string Mode, Table? Table, IReadOnlyList<string> Messages)
{
    public bool Succeeded => Table is not null;
}
