using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;

namespace Parity.Engine.IO.Internal;

/// <summary>A file's contents in the mode-neutral form; <see cref="ToTable"/> builds one mode's table from it.</summary>
internal sealed class SourceTable(IReadOnlyList<SourceColumn> columns, int rowCount)
{
    public IReadOnlyList<SourceColumn> Columns => columns;

    public int RowCount => rowCount;

    public Table ToTable(Mode mode)
    {
        var names = new string[columns.Count];
        var cols = new Column[columns.Count];
        for (var i = 0; i < cols.Length; i++)
        {
            names[i] = columns[i].Name;
            cols[i] = columns[i].ToColumn(mode);
        }
        return new Table(names, cols, rowCount);
    }
}
