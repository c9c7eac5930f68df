using Parity.Engine.Columns;

namespace Parity.Engine.Frames;

/// <summary>
/// What one write did to storage: the slot it replaced data in, the data before (null for a new column) and
/// after. Under <c>cow</c> <see cref="Slot"/> is the slot the frame used to point at, left unchanged.
/// </summary>
public sealed record WriteOutcome(ColumnSlot Slot, Column? Before, Column After, bool Added);
