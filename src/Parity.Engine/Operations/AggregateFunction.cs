namespace Parity.Engine.Operations;

/// <summary>The aggregates of spec §3.4: <c>count() count(c) sum avg min max first count_distinct</c>.</summary>
public enum AggregateFunction
{
    /// <summary><c>count()</c>: rows in the group.</summary>
    CountRows,

    /// <summary><c>count(c)</c>: non-missing cells.</summary>
    Count,
    Sum,
    Avg,
    Min,
    Max,

    /// <summary>The first non-missing value of the group, in row order.</summary>
    First,
    CountDistinct,
}
