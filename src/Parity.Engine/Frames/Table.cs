using Parity.Engine.Columns;

namespace Parity.Engine.Frames;

/// <summary>An immutable frame: named columns of equal length. Checkpoints, loaders and the differ use it.</summary>
public sealed class Table
{
    public Table(IReadOnlyList<string> names, IReadOnlyList<Column> columns, int rowCount)
    {
        if (names.Count != columns.Count) throw new ArgumentException("names and columns differ in count");
        for (var i = 0; i < columns.Count; i++)
            if (columns[i].Length != rowCount) throw new ArgumentException($"column '{names[i]}' has {columns[i].Length} rows, expected {rowCount}");
        Names = names;
        Columns = columns;
        RowCount = rowCount;
    }

    public IReadOnlyList<string> Names { get; }

    public IReadOnlyList<Column> Columns { get; }

    public int RowCount { get; }

    public int ColumnCount => Columns.Count;

    public int IndexOf(string name)
    {
        for (var i = 0; i < Names.Count; i++)
            if (string.Equals(Names[i], name, StringComparison.Ordinal)) return i;
        return -1;
    }

    public Column this[string name] => IndexOf(name) is var i and >= 0
        ? Columns[i]
        : throw new KeyNotFoundException($"no column '{name}'");
}
