namespace Parity;

/// <summary>A column of a checkpoint frame: its name and its type label in that mode (<c>int64</c>, <c>utf8</c>, <c>object</c>, ...).</summary>
/// <param name="Name">The column name.</param>
/// <param name="Type">The type label, as reports and golden files show it.</param>
public sealed record ParityColumn(string Name, string Type);
