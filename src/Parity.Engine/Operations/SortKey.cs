namespace Parity.Engine.Operations;

/// <summary>One key of an <c>order by</c>: a column name and its direction.</summary>
public readonly record struct SortKey(string Column, bool Descending);
