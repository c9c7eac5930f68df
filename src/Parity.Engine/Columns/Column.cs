using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Columns;

/// <summary>
/// An immutable column: typed buffers with a thin view on top. Writes never change a column; they build a
/// new one, and ownership of which frame sees which column lives in <see cref="Frames.ColumnSlot"/>.
/// <see cref="Marker"/> records the missing-value semantics the column was built under, because the same
/// bits mean different things per mode (a NaN double is missing under <c>nan</c> and a value under <c>null</c>).
/// </summary>
public abstract class Column
{
    protected Column(int length, MissingMarker marker)
    {
        Length = length;
        Marker = marker;
    }

    public int Length { get; }

    public MissingMarker Marker { get; }

    public abstract ColumnType Type { get; }

    /// <summary>The type label of spec §2.1.</summary>
    public string TypeLabel => Type.Label();

    public abstract bool IsMissing(int index);

    public abstract Value GetValue(int index);

    /// <summary>Number of missing cells (of any marker).</summary>
    public virtual int MissingCount
    {
        get
        {
            var n = 0;
            for (var i = 0; i < Length; i++)
                if (IsMissing(i)) n++;
            return n;
        }
    }

    /// <summary>A view of rows [offset, offset+length) that shares this column's buffers: O(1).</summary>
    public abstract Column Slice(int offset, int length);

    /// <summary>A deep copy with buffers of its own (the eager, defensive copy of <c>alias</c> mode).</summary>
    public abstract Column Clone();

    /// <summary>Gathers rows by index; an index of -1 yields a missing cell.</summary>
    public abstract Column Gather(ReadOnlySpan<int> rows);

    /// <summary>The missing marker this column shows for a missing cell (by type and mode).</summary>
    public MissingKind MissingKindOf => Marker == MissingMarker.Null
        ? MissingKind.Null
        : Type == ColumnType.Timestamp ? MissingKind.NaT : MissingKind.NaN;
}
