using System.Text;
using Parity.Engine.Columns;
using Parity.Engine.Frames;

namespace Parity.Harness.Showing;

/// <summary>
/// Renders a frame as an aligned text table: a header line of column names, a line of type labels, a rule,
/// then one line per row and a row count. Columns are aligned by display width (<see cref="DisplayWidth"/>),
/// numbers right-aligned; names and cells never carry control characters (they are escaped visibly).
/// </summary>
public static class TableText
{
    private const string Gap = "  ";

    public static void Write(Table table, TextWriter output)
    {
        var columns = table.ColumnCount;
        var rows = table.RowCount;
        var cells = new string[rows + 2, columns];
        var widths = new int[columns];
        var rightAlign = new bool[columns];
        for (var c = 0; c < columns; c++)
        {
            var column = table.Columns[c];
            cells[0, c] = ShowCell.Safe(table.Names[c]);
            cells[1, c] = column.TypeLabel;
            rightAlign[c] = column.Type is ColumnType.Int64 or ColumnType.Float64;
            for (var r = 0; r < rows; r++)
                cells[r + 2, c] = ShowCell.Display(column.GetValue(r));
        }
        var cellWidths = new int[rows + 2, columns];
        for (var r = 0; r < rows + 2; r++)
            for (var c = 0; c < columns; c++)
            {
                var w = DisplayWidth.Of(cells[r, c]);
                cellWidths[r, c] = w;
                if (w > widths[c]) widths[c] = w;
            }

        var line = new StringBuilder();
        for (var r = 0; r < rows + 2; r++)
        {
            line.Clear();
            for (var c = 0; c < columns; c++)
            {
                var last = c == columns - 1;
                var pad = widths[c] - cellWidths[r, c];
                // Headers (names, types) are left-aligned; number cells right-aligned.
                if (r >= 2 && rightAlign[c])
                {
                    line.Append(' ', pad).Append(cells[r, c]);
                }
                else
                {
                    line.Append(cells[r, c]);
                    if (!last) line.Append(' ', pad);
                }
                if (!last) line.Append(Gap);
            }
            output.WriteLine(line.ToString().TrimEnd(' '));
            if (r == 1)
            {
                line.Clear();
                for (var c = 0; c < columns; c++)
                {
                    if (c > 0) line.Append(Gap);
                    line.Append('-', Math.Max(widths[c], 1));
                }
                output.WriteLine(line.ToString());
            }
        }
        output.WriteLine(rows == 1 ? "(1 row)" : "(" + rows.ToString(System.Globalization.CultureInfo.InvariantCulture) + " rows)");
    }
}
