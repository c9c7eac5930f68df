using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using Parity.Script.Syntax;
using Table = Parity.Engine.Frames.Table;

namespace Parity.Harness.Shrinking.Internal;

/// <summary>
/// Runs the two modes on candidate fixtures and keeps the time bound: an attempt does not start when the
/// last attempt's cost per row says it would end after the bound.
/// </summary>
internal sealed class Attempts(ScriptNode script, ShrinkRequest request, string scriptDir, List<DataSource> sources, long start)
{
    private double _secondsPerRow;
    private double _baseSeconds;

    public int Count { get; private set; }

    public bool Stopped { get; private set; }

    /// <summary>The finding as the last attempt that kept it saw it (first: the run on the original data).</summary>
    public required Finding Last { get; set; }

    /// <summary>True while the time bound has not passed.</summary>
    public bool TimeLeft => request.Time.GetElapsedTime(start) < request.TimeLimit;

    /// <summary>
    /// True when the finding appears with <paramref name="rows"/> and <paramref name="keep"/> for
    /// <paramref name="source"/> (the other files as they stand); null when the time bound stops the reduction.
    /// </summary>
    public bool? Try(DataSource source, int[] rows, bool[] keep, string phase)
    {
        if (Stopped) return null;
        long total = 0;
        foreach (var s in sources) total += ReferenceEquals(s, source) ? rows.Length : s.Rows.Length;
        var elapsed = request.Time.GetElapsedTime(start).TotalSeconds;
        var expected = Count == 0 ? 0 : _baseSeconds + _secondsPerRow * total;
        if (elapsed + expected > request.TimeLimit.TotalSeconds)
        {
            Stopped = true;
            return null;
        }
        var before = request.Time.GetTimestamp();
        var subsets = new Dictionary<(DataSource, string), ReducedTable>();
        var options = request.RunOptions with
        {
            KeepParsedSources = false,
            TableSource = (full, loadOptions, mode) => Table(full, loadOptions, mode, source, rows, keep, subsets),
        };
        var runs = Shrinker.RunModes(script, request, scriptDir, options);
        var finding = FindingKeys.Find(ModeDiffer.CompareAll(runs, runs[0].ScriptFile, request.Diff), request.FindingKey);
        var found = finding is not null;
        if (finding is not null) Last = finding;
        Count++;
        var took = request.Time.GetElapsedTime(before).TotalSeconds;
        // Cost model: a fixed part (the smallest attempt so far) plus a part per row (the latest attempt).
        _baseSeconds = Count == 1 ? took : Math.Min(_baseSeconds, took);
        _secondsPerRow = Math.Max(0, took - _baseSeconds) / Math.Max(1, total);
        request.Progress?.Invoke(new ShrinkProgress(phase, Count, found ? CurrentRows(source, rows) : CurrentRows(source, source.Rows), RowsBefore(), request.Time.GetElapsedTime(start)));
        return found;
    }

    private Table? Table(string full, LoadOptions loadOptions, Mode mode, DataSource source, int[] rows, bool[] keep, Dictionary<(DataSource, string), ReducedTable> subsets)
    {
        var s = sources.Find(x => string.Equals(x.FullPath, full, StringComparison.Ordinal));
        if (s is null) return null;
        // One typed subset per file and set of missing tokens, shared by both modes of the attempt.
        var tokens = loadOptions.MissingTokens is null ? "\u0000" : string.Join('\u001e', loadOptions.MissingTokens);
        if (!subsets.TryGetValue((s, tokens), out var subset))
        {
            subset = ReferenceEquals(s, source) ? s.File.Select(rows, keep, loadOptions) : s.File.Select(s.Rows, s.Keep, loadOptions);
            subsets[(s, tokens)] = subset;
        }
        return subset.ToTable(mode);
    }

    private long CurrentRows(DataSource source, int[] rows)
    {
        long n = 0;
        foreach (var s in sources) n += ReferenceEquals(s, source) ? rows.Length : s.Rows.Length;
        return n;
    }

    private long RowsBefore()
    {
        long n = 0;
        foreach (var s in sources) n += s.File.RowCount;
        return n;
    }
}
