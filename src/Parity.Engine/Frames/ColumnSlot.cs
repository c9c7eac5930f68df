using Parity.Engine.Columns;

namespace Parity.Engine.Frames;

/// <summary>
/// The unit of storage ownership. A frame column points at a slot; under <c>alias</c> a view and its parent
/// point at the same slot, so a write through either replaces <see cref="Data"/> for both. Under <c>cow</c>
/// every frame gets slots of its own that share the same immutable <see cref="Column"/> until a write
/// installs a new one.
/// </summary>
public sealed class ColumnSlot
{
    public ColumnSlot(Column data)
    {
        Data = data;
    }

    public Column Data { get; set; }
}
