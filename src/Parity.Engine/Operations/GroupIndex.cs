namespace Parity.Engine.Operations;

/// <summary>
/// The result of grouping rows: which group each row belongs to (groups numbered 0..GroupCount-1 in
/// ascending key order), the first row of each group, and how many rows were dropped for a missing key.
/// </summary>
public sealed class GroupIndex
{
    public GroupIndex(int[] groupOf, int groupCount, int[] representative, int droppedRows)
    {
        if (representative.Length != groupCount) throw new ArgumentException("one representative per group expected", nameof(representative));
        GroupOf = groupOf;
        GroupCount = groupCount;
        Representative = representative;
        DroppedRows = droppedRows;
    }

    /// <summary>Group number of each input row, or -1 for a row dropped because a key is missing.</summary>
    public int[] GroupOf { get; }

    public int GroupCount { get; }

    /// <summary>The first input row of each group (gather it to get the key columns of the result).</summary>
    public int[] Representative { get; }

    /// <summary>Rows dropped because a key is missing (spec §2.2: a report note counts them).</summary>
    public int DroppedRows { get; }

    public int RowCount => GroupOf.Length;

    /// <summary>Every row in one group (an aggregate over a whole frame); no group at all when there are no rows.</summary>
    public static GroupIndex Single(int rowCount) =>
        new(new int[rowCount], rowCount > 0 ? 1 : 0, rowCount > 0 ? [0] : [], 0);
}
