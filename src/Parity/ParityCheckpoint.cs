using Microsoft.Data.Analysis;
using Parity.Engine.Frames;
using Parity.Interop;

namespace Parity;

/// <summary>One checkpoint's frame in one mode, as the script recorded it.</summary>
public sealed class ParityCheckpoint
{
    private readonly Table _table;

    internal ParityCheckpoint(string script, string label, int line, string mode, Table table)
    {
        Script = script;
        Label = label;
        Line = line;
        Mode = mode;
        _table = table;
        var columns = new ParityColumn[table.ColumnCount];
        for (var i = 0; i < columns.Length; i++) columns[i] = new ParityColumn(table.Names[i], table.Columns[i].TypeLabel);
        Columns = columns;
    }

    /// <summary>The script path relative to the working directory, forward slashes.</summary>
    public string Script { get; }

    /// <summary>The checkpoint label (the frame's name unless the script gave one with <c>as</c>).</summary>
    public string Label { get; }

    /// <summary>The 1-based line of the <c>check</c> statement.</summary>
    public int Line { get; }

    /// <summary>The mode the frame was computed in (<c>legacy</c>, <c>modern</c> or a spelling).</summary>
    public string Mode { get; }

    /// <summary>The number of rows.</summary>
    public int RowCount => _table.RowCount;

    /// <summary>The columns in order, with their type label in <see cref="Mode"/>.</summary>
    public IReadOnlyList<ParityColumn> Columns { get; }

    /// <summary>The frame as the engine holds it, for the interop code.</summary>
    internal Table Table => _table;

    /// <summary>
    /// The frame as a <see cref="DataFrame"/>: int64, float64, bool and timestamp columns become primitive
    /// columns, an Arrow string column an <see cref="ArrowStringDataFrameColumn"/> over the same buffers, a
    /// boxed string column a <see cref="StringDataFrameColumn"/>; every missing cell is a DataFrame null.
    /// docs/data.md ("Frames from code") lists each conversion.
    /// </summary>
    public DataFrame ToDataFrame() => TableFrames.ToDataFrame(_table);

    /// <inheritdoc/>
    public override string ToString() => Script + " checkpoint '" + Label + "' in " + Mode + " (" + RowCount.ToString(System.Globalization.CultureInfo.InvariantCulture) + " rows)";
}
