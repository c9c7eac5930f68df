namespace Parity.Harness.Project.Internal;

/// <summary>
/// One value of the project file with the 1-based line and column where it starts, so every bad value
/// can be reported where it is. Objects keep their members in file order.
/// </summary>
internal sealed class ConfigNode
{
    public required ConfigNodeKind Kind { get; init; }

    public required int Line { get; init; }

    public required int Column { get; init; }

    public string? Text { get; init; }

    public double Number { get; init; }

    /// <summary>The number exactly as written (to tell <c>3</c> from <c>3.0</c> and to reject fractions where a count is due).</summary>
    public string? RawNumber { get; init; }

    public bool Bool { get; init; }

    public List<(string Name, int Line, int Column, ConfigNode Value)> Members { get; } = [];

    public List<ConfigNode> Items { get; } = [];

    public string KindName => Kind switch
    {
        ConfigNodeKind.Object => "an object",
        ConfigNodeKind.Array => "a list",
        ConfigNodeKind.String => "a string",
        ConfigNodeKind.Number => "a number",
        ConfigNodeKind.Bool => "true or false",
        _ => "null",
    };
}
