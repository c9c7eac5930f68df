using Parity.Engine.IO.Internal;
using Parity.Engine.Modes;
using Table = Parity.Engine.Frames.Table;

namespace Parity.Engine.IO;

/// <summary>A subset of a <see cref="ReducibleFile"/>, typed once; each mode gets its table from it as a load would.</summary>
public sealed class ReducedTable
{
    internal ReducedTable(SourceTable source) => Source = source;

    internal SourceTable Source { get; }

    public int RowCount => Source.RowCount;

    public Table ToTable(Mode mode) => Source.ToTable(mode);
}
