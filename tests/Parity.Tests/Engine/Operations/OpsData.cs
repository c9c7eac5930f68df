using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.Operations;

/// <summary>Small builders for operation tests: Harbor Line ferry data as cells, columns and tables.</summary>
internal static class OpsData
{
    /// <summary>A cell: null is the mode's missing value; ints become int64.</summary>
    public static Value V(object? o) => o switch
    {
        null => Value.Null,
        Value v => v,
        int i => Value.Of((long)i),
        long l => Value.Of(l),
        double d => Value.Of(d),
        string s => Value.Of(s),
        bool b => Value.Of(b),
        DateTime t => Value.Timestamp(ValueText.ToMicros(new DateTimeOffset(t, TimeSpan.Zero))),
        _ => throw new ArgumentException("unsupported cell", nameof(o)),
    };

    public static Column Col(Mode mode, params object?[] cells)
    {
        var values = new Value[cells.Length];
        for (var i = 0; i < cells.Length; i++) values[i] = V(cells[i]);
        return ColumnFactory.FromValues(values, mode);
    }

    public static Table Table(params (string Name, Column Column)[] columns)
    {
        var names = new string[columns.Length];
        var cols = new Column[columns.Length];
        for (var i = 0; i < columns.Length; i++) (names[i], cols[i]) = columns[i];
        return new Table(names, cols, cols.Length == 0 ? 0 : cols[0].Length);
    }

    public static Value[] Values(Column column) => ColumnFactory.ToValues(column);

    /// <summary>The missing value a column shows under a mode for a non-timestamp cell that became missing.</summary>
    public static Value Missing(Mode mode) => mode.IsNan ? Value.NaN : Value.Null;

    public static Mode M(string spelling) => Mode.Parse(spelling);
}
