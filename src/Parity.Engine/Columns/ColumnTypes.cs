namespace Parity.Engine.Columns;

/// <summary>Type labels and parsing for <see cref="ColumnType"/>.</summary>
public static class ColumnTypes
{
    /// <summary>The label of spec §2.1: <c>int64</c>, <c>float64</c>, <c>bool</c>, <c>timestamp</c>, <c>utf8</c>, <c>object</c>.</summary>
    public static string Label(this ColumnType type) => type switch
    {
        ColumnType.Int64 => "int64",
        ColumnType.Float64 => "float64",
        ColumnType.Bool => "bool",
        ColumnType.Timestamp => "timestamp",
        ColumnType.Utf8 => "utf8",
        _ => "object",
    };

    public static bool TryParseLabel(string label, out ColumnType type)
    {
        switch (label)
        {
            case "int64": type = ColumnType.Int64; return true;
            case "float64": type = ColumnType.Float64; return true;
            case "bool": type = ColumnType.Bool; return true;
            case "timestamp": type = ColumnType.Timestamp; return true;
            case "utf8": type = ColumnType.Utf8; return true;
            case "object": type = ColumnType.Object; return true;
            default: type = ColumnType.Object; return false;
        }
    }
}
