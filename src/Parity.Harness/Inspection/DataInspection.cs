namespace Parity.Harness.Inspection;

/// <summary>What <c>parity inspect</c> reports about one data file (spec §4).</summary>
public sealed record DataInspection(string File, int Rows, IReadOnlyList<ColumnInspection> Columns)
{
    public long BytesBoxed
    {
        get
        {
            long total = 0;
            foreach (var c in Columns) total += c.BytesBoxed;
            return total;
        }
    }

    public long BytesArrow
    {
        get
        {
            long total = 0;
            foreach (var c in Columns) total += c.BytesArrow;
            return total;
        }
    }

    public int Missing
    {
        get
        {
            var total = 0;
            foreach (var c in Columns) total += c.Missing;
            return total;
        }
    }
}
