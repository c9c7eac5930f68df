using Parity.Engine.Columns;

namespace Parity.Engine.Frames;

/// <summary>
/// What one write did to storage: the slot it replaced data in, the data before (null for a new column or a
/// fresh slot) and after. Under <c>cow</c> <see cref="Slot"/> is the slot the frame used to point at, left
/// unchanged; under <c>alias</c> a write that changes the column's type reports the fresh slot the writing frame
/// now owns alone (<see cref="Before"/> null: no other frame's storage changed).
/// </summary>
public sealed record WriteOutcome(ColumnSlot Slot, Column? Before, Column After, bool Added);
