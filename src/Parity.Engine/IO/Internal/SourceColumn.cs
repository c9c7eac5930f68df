using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// One loaded column in a mode-neutral form: typed buffers plus validity, as read from the file. Each mode
/// gets its own <see cref="Column"/> from it (spec §2.1); buffers are shared between modes where the
/// representation agrees, which is safe because columns are immutable.
/// </summary>
internal abstract class SourceColumn
{
    protected SourceColumn(string name, int length)
    {
        Name = name;
        Length = length;
    }

    public string Name { get; }

    public int Length { get; }

    public abstract Column ToColumn(Mode mode);
}
