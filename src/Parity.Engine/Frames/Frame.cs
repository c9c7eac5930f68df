using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;

namespace Parity.Engine.Frames;

/// <summary>
/// A named frame of the interpreter: columns that point into slots. This is where the <c>writes</c> axis
/// lives: which derivations share slots (views under <c>alias</c>), which share immutable columns through
/// fresh slots (<c>cow</c>), and which copy eagerly (<c>alias</c>, every other derivation).
/// </summary>
public sealed class Frame
{
    private readonly List<FrameColumn> _columns;

    private Frame(List<FrameColumn> columns, int rowCount)
    {
        _columns = columns;
        RowCount = rowCount;
    }

    public int RowCount { get; }

    public IReadOnlyList<FrameColumn> Columns => _columns;

    public int ColumnCount => _columns.Count;

    /// <summary>True when this frame was made by <see cref="View"/> or <see cref="ViewColumn"/> (alias only).</summary>
    public bool IsView { get; private init; }

    public int IndexOf(string name)
    {
        for (var i = 0; i < _columns.Count; i++)
            if (string.Equals(_columns[i].Name, name, StringComparison.Ordinal)) return i;
        return -1;
    }

    public Column GetColumn(string name) => IndexOf(name) is var i and >= 0
        ? _columns[i].Column
        : throw new KeyNotFoundException($"no column '{name}'");

    public IReadOnlyList<string> Names
    {
        get
        {
            var names = new string[_columns.Count];
            for (var i = 0; i < names.Length; i++) names[i] = _columns[i].Name;
            return names;
        }
    }

    /// <summary>The current contents as an immutable table: O(columns), shares buffers.</summary>
    public Table Snapshot()
    {
        var names = new string[_columns.Count];
        var cols = new Column[_columns.Count];
        for (var i = 0; i < cols.Length; i++)
        {
            names[i] = _columns[i].Name;
            cols[i] = _columns[i].Column;
        }
        return new Table(names, cols, RowCount);
    }

    /// <summary>A frame that owns its table's columns (a load).</summary>
    public static Frame FromTable(Table table)
    {
        var list = new List<FrameColumn>(table.ColumnCount);
        for (var i = 0; i < table.ColumnCount; i++)
            list.Add(new FrameColumn(table.Names[i], new ColumnSlot(table.Columns[i]), 0, table.RowCount));
        return new Frame(list, table.RowCount);
    }

    /// <summary>
    /// A derived frame from computed columns. Under <c>cow</c> it shares them (O(columns)); under <c>alias</c>
    /// every column is copied eagerly, as legacy stacks did. With <paramref name="input"/>, a column that is
    /// not one of its columns was made by the operation itself (a filter, a gather, a join) and is already a
    /// copy nobody else holds, so it is not copied a second time: on a large frame that second copy doubled
    /// the step's peak.
    /// </summary>
    public static Frame Derive(Table result, Mode mode, Table? input = null)
    {
        var list = new List<FrameColumn>(result.ColumnCount);
        for (var i = 0; i < result.ColumnCount; i++)
        {
            var col = result.Columns[i];
            if (mode.IsAlias && (input is null || Holds(input, col))) col = col.Clone();
            list.Add(new FrameColumn(result.Names[i], new ColumnSlot(col), 0, result.RowCount));
        }
        return new Frame(list, result.RowCount);
    }

    private static bool Holds(Table table, Column column)
    {
        foreach (var c in table.Columns)
            if (ReferenceEquals(c, column)) return true;
        return false;
    }

    /// <summary>Rows [offset, offset+length) as a view that shares this frame's slots (alias <c>take</c>/<c>skip</c>).</summary>
    public Frame View(int offset, int length)
    {
        var list = new List<FrameColumn>(_columns.Count);
        foreach (var c in _columns)
            list.Add(c with { Offset = c.Offset + offset, Length = length });
        return new Frame(list, length) { IsView = true };
    }

    /// <summary>One column as a view that shares its slot (alias <c>column c</c>).</summary>
    public Frame ViewColumn(string name)
    {
        var i = IndexOf(name);
        if (i < 0) throw new KeyNotFoundException($"no column '{name}'");
        return new Frame([_columns[i]], RowCount) { IsView = true };
    }

    /// <summary>
    /// Writes a whole column of this frame's rows (the caller has already blended the old and new values).
    /// Under <c>alias</c> the value is spliced into the shared slot, so every view relative sees it; under
    /// <c>cow</c> the frame gets a fresh slot and nobody else is touched. A new name adds a column owned by
    /// this frame alone (a view's new column does not reach its parent).
    /// <para>
    /// A write under <c>alias</c> that changes the column's type (a missing value into int64 or bool under
    /// <c>nan</c>, a string into a number column under <c>boxed</c>, a float into int64) cannot go into storage
    /// of the old type: this frame gets its own slot holding the new column, and every other frame keeps the old
    /// slot, unchanged and still shared among them. Only that column stops being shared; the frame's other
    /// columns stay in their shared slots. The same holds whichever side writes, view or parent
    /// (docs/semantics.md, "A write that changes the column's type").
    /// </para>
    /// </summary>
    public WriteOutcome Write(string name, Column values, Mode mode)
    {
        if (values.Length != RowCount) throw new ArgumentException("write length differs from the frame's row count");
        var i = IndexOf(name);
        if (i < 0)
        {
            var slot = new ColumnSlot(values);
            _columns.Add(new FrameColumn(name, slot, 0, RowCount));
            return new WriteOutcome(slot, null, values, true);
        }
        var fc = _columns[i];
        var before = fc.Slot.Data;
        if (mode.IsCow)
        {
            var slot = new ColumnSlot(values);
            _columns[i] = new FrameColumn(name, slot, 0, RowCount);
            return new WriteOutcome(fc.Slot, fc.Column, values, false);
        }
        if (values.Type != fc.Column.Type)
        {
            var own = new ColumnSlot(values);
            _columns[i] = new FrameColumn(name, own, 0, RowCount);
            return new WriteOutcome(own, null, values, false);
        }
        var after = ColumnFactory.Splice(before, fc.Offset, values, mode, ErrorCodes.TypeWrite);
        fc.Slot.Data = after;
        return new WriteOutcome(fc.Slot, before, after, false);
    }
}
