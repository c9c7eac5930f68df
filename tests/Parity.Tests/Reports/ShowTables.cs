using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Reports;

/// <summary>Harbor Line frames built directly, for the <c>show</c> renderers.</summary>
internal static class ShowTables
{
    public static Table Build(Mode mode, params (string Name, ColumnType Type, Value[] Values)[] columns)
    {
        var names = new List<string>();
        var cols = new List<Column>();
        foreach (var (name, type, values) in columns)
        {
            names.Add(name);
            cols.Add(ColumnFactory.Build(values, type, mode));
        }
        return new Table(names, cols, columns.Length == 0 ? 0 : columns[0].Values.Length);
    }

    public static long Micros(int year, int month, int day, int hour, int minute) =>
        ValueText.ToMicros(new DateTimeOffset(year, month, day, hour, minute, 0, TimeSpan.Zero));
}
