namespace Parity.Harness.Findings;

/// <summary>
/// One listed change: a changed cell (both rows and the column), an added row (no golden row, no column,
/// <see cref="Now"/> the row's cells), a removed row (no current row), or a changed statement record (no
/// rows; <see cref="Column"/> names the record). Cells are in the golden text form; rows are 0-based.
/// </summary>
public sealed record GoldenChange(long? RowGolden, long? RowNow, string? Column, string? Golden, string? Now);
