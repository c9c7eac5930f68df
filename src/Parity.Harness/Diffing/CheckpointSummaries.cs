using Parity.Harness.Findings;
using Parity.Script.Running;

namespace Parity.Harness.Diffing;

/// <summary>Builds the per-checkpoint summaries (rows and column types per mode) of a set of runs.</summary>
public static class CheckpointSummaries
{
    /// <summary>One summary per label, in the order the first run that reached it met it; modes in run order.</summary>
    public static IReadOnlyList<CheckpointSummary> Build(IReadOnlyList<ModeRun> runs)
    {
        var order = new List<(string Label, int Line)>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var run in runs)
            foreach (var c in run.Checkpoints)
                if (seen.Add(c.Label)) order.Add((c.Label, c.Line));
        var result = new List<CheckpointSummary>(order.Count);
        foreach (var (label, line) in order)
        {
            var perMode = new Dictionary<string, CheckpointShape>(StringComparer.Ordinal);
            foreach (var run in runs)
            {
                var c = run.FindCheckpoint(label);
                if (c is null) continue;
                perMode[run.Mode.Name] = Shape(c);
            }
            result.Add(new CheckpointSummary(label, line, perMode));
        }
        return result;
    }

    public static CheckpointShape Shape(CheckpointResult c)
    {
        var cols = new ColumnShape[c.Table.ColumnCount];
        for (var i = 0; i < cols.Length; i++) cols[i] = new ColumnShape(c.Table.Names[i], c.Table.Columns[i].TypeLabel);
        return new CheckpointShape(c.Table.RowCount, cols);
    }
}
