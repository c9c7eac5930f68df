using Parity.Engine.Columns;

namespace Parity.Engine.Frames;

/// <summary>A named column of a frame: rows [Offset, Offset+Length) of a (possibly shared) slot.</summary>
public readonly record struct FrameColumn(string Name, ColumnSlot Slot, int Offset, int Length)
{
    /// <summary>The visible rows, as an O(1) slice of the slot's current data.</summary>
    public Column Column => Offset == 0 && Length == Slot.Data.Length ? Slot.Data : Slot.Data.Slice(Offset, Length);
}
