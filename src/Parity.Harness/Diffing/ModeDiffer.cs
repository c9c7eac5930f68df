using System.Globalization;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Values;
using Parity.Harness.Diffing.Internal;
using Parity.Harness.Findings;
using Parity.Harness.Formatting;
using Parity.Script.Running;
using Parity.Script.Syntax;

namespace Parity.Harness.Diffing;

/// <summary>
/// Compares two runs of one script (spec §5): checkpoint by checkpoint, matched by label (<c>shape</c>,
/// <c>type</c>, <c>value</c>, <c>missing</c>), and statement by statement (<c>alias</c>, <c>warning</c>,
/// <c>error</c>, and the <c>missing</c> notes of rows dropped by a null condition or a missing group key).
/// <para>
/// Rows are aligned by position. When the row counts differ there is no safe alignment (a dropped row
/// shifts every row after it), so the differ reports one <c>shape</c> finding whose samples start at the
/// first row where the frames stop agreeing, plus the <c>type</c> findings, and no per-cell findings.
/// </para>
/// <para>
/// A type difference that the modes predict (int64 against float64, object against utf8) is one
/// <c>type</c> finding; numbers are compared by value across int64 and float64, so equal numbers of a
/// different type give no <c>value</c> findings.
/// </para>
/// </summary>
public static class ModeDiffer
{
    /// <summary>Most rows searched for the samples of a type finding.</summary>
    private const int TypeSampleScan = 10_000;

    /// <summary>
    /// Diffs the run nearest legacy (the baseline, <see cref="ModeOrder"/>) against every other run, whatever
    /// order the runs come in; findings in a deterministic order.
    /// </summary>
    public static IReadOnlyList<Finding> CompareAll(IReadOnlyList<ModeRun> runs, string script, DiffOptions options)
    {
        var sorted = new List<ModeRun>(runs);
        sorted.Sort((x, y) => ModeOrder.Compare(x.Mode, y.Mode));
        var all = new List<Finding>();
        for (var i = 1; i < sorted.Count; i++)
            all.AddRange(Compare(sorted[0], sorted[i], script, options));
        all.Sort(FindingOrder.Instance);
        return all;
    }

    /// <summary>
    /// Diffs two runs. The pair is canonical: the mode nearer legacy is always the first side, so swapping the
    /// arguments gives the same findings. Differences that recur at later checkpoints are one finding with
    /// <see cref="Finding.AlsoAt"/>, and value and missing differences after a write whose aliasing sets differ
    /// carry <see cref="Finding.CausedBy"/> (<see cref="RootCauses"/>).
    /// </summary>
    public static IReadOnlyList<Finding> Compare(ModeRun a, ModeRun b, string script, DiffOptions options)
    {
        if (ModeOrder.Compare(a.Mode, b.Mode) > 0) (a, b) = (b, a);
        var ctx = new Context(a, b, options);
        CompareStatements(ctx);
        CompareCheckpoints(ctx);
        var modes = new[] { a.Mode.Name, b.Mode.Name };
        var list = new List<Finding>(ctx.Groups.Count);
        foreach (var g in ctx.Groups.Values)
            list.Add(g.ToFinding(script, modes, countReasons: g.Kind == FindingKind.Missing, g.Checkpoint is null ? ctx.Keys.KeyAt(g.Line) : null));
        list.Sort(FindingOrder.Instance);
        return RootCauses.Group(list, ctx.AliasWrites);
    }

    private sealed class Context
    {
        public Context(ModeRun a, ModeRun b, DiffOptions options)
        {
            A = a;
            B = b;
            Options = options;
            NameA = a.Mode.Name;
            NameB = b.Mode.Name;
            // Statements at or after the line where a mode stopped were not run by it: not comparable.
            var la = a.Failure is null ? int.MaxValue : a.Failure.Span.LineNumber;
            var lb = b.Failure is null ? int.MaxValue : b.Failure.Span.LineNumber;
            StopLine = Math.Min(la, lb);
            Keys = new StatementKeys(a.Statements.Count > 0 ? a.Statements : b.Statements);
        }

        /// <summary>Statement keys of the script (both runs ran the same statements).</summary>
        public StatementKeys Keys { get; }

        /// <summary>Writes whose aliasing sets differ: their line and the column they write.</summary>
        public List<(int Line, string Column)> AliasWrites { get; } = [];

        public ModeRun A { get; }

        public ModeRun B { get; }

        public DiffOptions Options { get; }

        public string NameA { get; }

        public string NameB { get; }

        public int StopLine { get; }

        public Dictionary<string, FindingGroup> Groups { get; } = new(StringComparer.Ordinal);

        /// <summary>Named frames whose aliasing sets differ between the modes (they explain value findings).</summary>
        public HashSet<string> AliasedFrames { get; } = new(StringComparer.Ordinal);

        /// <summary>The first line of a write whose aliasing sets differ, or int.MaxValue.</summary>
        public int FirstAliasLine { get; set; } = int.MaxValue;

        public FindingGroup Group(FindingKind kind, int line, string? checkpoint, string? column)
        {
            var key = ((int)kind).ToString(CultureInfo.InvariantCulture) + "\u0001" + (checkpoint ?? "\u0002" + line.ToString(CultureInfo.InvariantCulture)) + "\u0001" + (column ?? "\u0002");
            if (!Groups.TryGetValue(key, out var g))
            {
                g = new FindingGroup(kind, line, checkpoint, column, Options.MaxSamples);
                Groups.Add(key, g);
            }
            return g;
        }
    }

    // ---- statements -------------------------------------------------------------------------------

    private static void CompareStatements(Context ctx)
    {
        CompareFailures(ctx);
        CompareWrites(ctx);
        CompareWarnings(ctx);
        CompareNotes(ctx);
    }

    private static void CompareFailures(Context ctx)
    {
        var fa = ctx.A.Failure;
        var fb = ctx.B.Failure;
        if ((fa is null) == (fb is null)) return; // neither failed, or both did (the runner fails the script)
        var failed = fa is not null ? ctx.A : ctx.B;
        var other = fa is not null ? ctx.B : ctx.A;
        var f = failed.Failure!;
        var missed = new List<string>();
        foreach (var c in other.Checkpoints)
            if (failed.FindCheckpoint(c.Label) is null) missed.Add(CellText.Quote(c.Label));
        var reason = f.Code + " in " + failed.Mode.Name + " only: " + CellText.Safe(f.Message)
            + (missed.Count == 0 ? "" : "; checkpoints " + failed.Mode.Name + " never reached: " + string.Join(", ", missed));
        var g = ctx.Group(FindingKind.Error, f.Span.LineNumber, null, null);
        g.Add(reason, 1, ErrorHint(f.Code, ctx.Keys.StatementAt(f.Span.LineNumber)), 0, f.Code + " in " + failed.Mode.Name + " only");
        var failedText = "error " + f.Code + ": " + CellText.Safe(f.Message);
        var otherText = "ran on";
        g.Sample(null, failed == ctx.A ? [failedText, otherText] : [otherText, failedText]);
    }

    private static string ErrorHint(string code, Statement? statement) => code switch
    {
        ErrorCodes.Cast => MigrationHints.CastError,
        ErrorCodes.TypeWrite or ErrorCodes.Type => MigrationHints.TypeWriteError,
        ErrorCodes.MaskMissing => ConditionHints.MaskMissing(statement),
        ErrorCodes.AggType => MigrationHints.AggTypeError,
        _ => MigrationHints.OtherError,
    };

    private static void CompareWrites(Context ctx)
    {
        var byPlace = new Dictionary<(int, int), WriteRecord>();
        foreach (var w in ctx.B.Writes) byPlace.TryAdd((w.Line, w.Column), w);
        foreach (var wa in ctx.A.Writes)
        {
            if (wa.Line >= ctx.StopLine) continue;
            if (!byPlace.TryGetValue((wa.Line, wa.Column), out var wb)) continue;
            var sa = Sorted(wa.ChangedFrames);
            var sb = Sorted(wb.ChangedFrames);
            if (SameSet(sa, sb)) continue;
            ctx.FirstAliasLine = Math.Min(ctx.FirstAliasLine, wa.Line);
            if (ctx.Keys.StatementAt(wa.Line) is SetStatement set && !ctx.AliasWrites.Contains((wa.Line, set.Column.Name)))
                ctx.AliasWrites.Add((wa.Line, set.Column.Name));
            foreach (var n in sa) if (!sb.Contains(n)) ctx.AliasedFrames.Add(n);
            foreach (var n in sb) if (!sa.Contains(n)) ctx.AliasedFrames.Add(n);
            var chained = wa.Target.StartsWith('(') || HasWarning(ctx.A, wa.Line, ErrorCodes.ChainedWrite) || HasWarning(ctx.B, wa.Line, ErrorCodes.ChainedWrite);
            var maybeCopy = HasWarning(ctx.A, wa.Line, ErrorCodes.MaybeCopy) || HasWarning(ctx.B, wa.Line, ErrorCodes.MaybeCopy);
            var hint = chained ? MigrationHints.ChainedWrite : maybeCopy ? MigrationHints.MaybeCopy : MigrationHints.ViewWrite;
            var g = ctx.Group(FindingKind.Alias, wa.Line, null, null);
            var changed = "changed " + SetText(sa) + " in " + ctx.NameA + " and " + SetText(sb) + " in " + ctx.NameB;
            g.Add("the write to " + CellText.Safe(wa.Target) + " " + changed, 1, hint, 0, changed);
            g.Sample(null, SetText(sa), SetText(sb));
        }
    }

    private static void CompareWarnings(Context ctx)
    {
        OneSidedWarnings(ctx, ctx.A, ctx.B, first: true);
        OneSidedWarnings(ctx, ctx.B, ctx.A, first: false);
    }

    private static void OneSidedWarnings(Context ctx, ModeRun has, ModeRun lacks, bool first)
    {
        foreach (var w in has.Warnings)
        {
            if (w.Line >= ctx.StopLine) continue;
            var matched = false;
            foreach (var o in lacks.Warnings)
            {
                if (o.Line == w.Line && o.Column == w.Column && string.Equals(o.Code, w.Code, StringComparison.Ordinal)) { matched = true; break; }
            }
            if (matched) continue;
            var hint = w.Code switch
            {
                ErrorCodes.ChainedWrite => MigrationHints.ChainedWrite,
                ErrorCodes.MaybeCopy => MigrationHints.MaybeCopy,
                _ => MigrationHints.Warning,
            };
            var g = ctx.Group(FindingKind.Warning, w.Line, null, null);
            g.Add(w.Code + " in " + has.Mode.Name + " only: " + CellText.Safe(w.Message), 1, hint, 0, w.Code + " in " + has.Mode.Name + " only");
            var hasText = w.Code + "; reached " + SetText(Sorted(w.ReachedFrames));
            var otherWrite = FindWrite(lacks, w.Line);
            var lacksText = "no warning" + (otherWrite is null ? "" : "; reached " + SetText(Sorted(otherWrite.ChangedFrames)));
            g.Sample(null, first ? [hasText, lacksText] : [lacksText, hasText]);
        }
    }

    private static void CompareNotes(Context ctx)
    {
        var totals = new SortedDictionary<(int Line, string Kind), (long A, long B)>(NoteOrder.Instance);
        foreach (var n in ctx.A.Notes)
        {
            if (n.Line >= ctx.StopLine) continue;
            totals.TryGetValue((n.Line, n.Kind), out var t);
            totals[(n.Line, n.Kind)] = (t.A + n.Count, t.B);
        }
        foreach (var n in ctx.B.Notes)
        {
            if (n.Line >= ctx.StopLine) continue;
            totals.TryGetValue((n.Line, n.Kind), out var t);
            totals[(n.Line, n.Kind)] = (t.A, t.B + n.Count);
        }
        foreach (var ((line, kind), (ca, cb)) in totals)
        {
            if (ca == cb) continue;
            var what = kind == RunNote.NullCondition ? "rows dropped because the condition was null"
                : kind == RunNote.MissingGroupKey ? "rows dropped from grouping because the key was missing"
                : "rows counted by note " + CellText.Safe(kind);
            var hint = kind == RunNote.MissingGroupKey ? MigrationHints.MissingGroupKey : MigrationHints.NullCondition;
            var g = ctx.Group(FindingKind.Missing, line, null, null);
            g.Add(what + ": " + Num(ca) + " in " + ctx.NameA + ", " + Num(cb) + " in " + ctx.NameB, Math.Abs(ca - cb), hint, kind == RunNote.NullCondition ? 1 : 0, what);
            g.Sample(null, Num(ca) + " rows", Num(cb) + " rows");
        }
    }

    // ---- checkpoints ------------------------------------------------------------------------------

    private static void CompareCheckpoints(Context ctx)
    {
        foreach (var ca in ctx.A.Checkpoints)
        {
            var cb = ctx.B.FindCheckpoint(ca.Label);
            if (cb is null)
            {
                if (ctx.B.Failure is null) OnlyIn(ctx, ca, ctx.NameA, ctx.NameB);
                continue;
            }
            CompareTables(ctx, ca, cb);
        }
        if (ctx.A.Failure is not null) return;
        foreach (var cb in ctx.B.Checkpoints)
            if (ctx.A.FindCheckpoint(cb.Label) is null) OnlyIn(ctx, cb, ctx.NameB, ctx.NameA);
    }

    private static void OnlyIn(Context ctx, CheckpointResult c, string has, string lacks)
    {
        var g = ctx.Group(FindingKind.Shape, c.Line, c.Label, null);
        var text = "checkpoint reached in " + has + " but not in " + lacks;
        g.Add(text, 1, MigrationHints.Checkpoint, 0, text);
    }

    private static void CompareTables(Context ctx, CheckpointResult ca, CheckpointResult cb)
    {
        Table ta = ca.Table, tb = cb.Table;
        var label = ca.Label;
        var line = ca.Line;

        // Columns present in one mode only, then the relative order of the shared ones.
        var commonA = new List<string>();
        foreach (var n in ta.Names)
        {
            if (tb.IndexOf(n) >= 0) { commonA.Add(n); continue; }
            var g = ctx.Group(FindingKind.Shape, line, label, n);
            g.Add("column only in " + ctx.NameA, 1, MigrationHints.ColumnSet, 0, "column only in " + ctx.NameA);
        }
        var commonB = new List<string>();
        foreach (var n in tb.Names)
        {
            if (ta.IndexOf(n) >= 0) { commonB.Add(n); continue; }
            var g = ctx.Group(FindingKind.Shape, line, label, n);
            g.Add("column only in " + ctx.NameB, 1, MigrationHints.ColumnSet, 0, "column only in " + ctx.NameB);
        }
        for (var i = 0; i < commonA.Count; i++)
        {
            if (string.Equals(commonA[i], commonB[i], StringComparison.Ordinal)) continue;
            var g = ctx.Group(FindingKind.Shape, line, label, commonA[i]);
            g.Add("column at position " + Num(ta.IndexOf(commonA[i]) + 1) + " in " + ctx.NameA + " and " + Num(tb.IndexOf(commonA[i]) + 1) + " in " + ctx.NameB, 1, MigrationHints.ColumnOrder, 0, "column order");
        }

        // Type labels per shared column.
        foreach (var n in commonA)
        {
            var colA = ta[n];
            var colB = tb[n];
            if (string.Equals(colA.TypeLabel, colB.TypeLabel, StringComparison.Ordinal)) continue;
            var g = ctx.Group(FindingKind.Type, line, label, n);
            var typeText = "type " + colA.TypeLabel + " in " + ctx.NameA + ", " + colB.TypeLabel + " in " + ctx.NameB;
            g.Add(typeText, 1, TypeHint(colA, colB), 0, typeText);
            g.FromTo(colA.TypeLabel, colB.TypeLabel);
            // Samples show how the representation differs (34.0 against 34); the search is bounded because a
            // storage-only difference (object against utf8) displays the same in every row.
            var rows = Math.Min(Math.Min(ta.RowCount, tb.RowCount), TypeSampleScan);
            for (var r = 0; r < rows && g.WantsSample; r++)
            {
                var da = CellText.Display(colA.GetValue(r));
                var db = CellText.Display(colB.GetValue(r));
                if (!string.Equals(da, db, StringComparison.Ordinal)) g.Sample(r, da, db);
            }
        }

        if (ta.RowCount != tb.RowCount)
        {
            RowCountFinding(ctx, ca, cb, commonA);
            return;
        }

        // A write that reached other frames in one mode explains value differences of its frames and of
        // anything derived from them later; the differ cannot trace derivations, so any later checkpoint counts.
        var aliased = ctx.AliasedFrames.Contains(ca.FrameName) || ctx.AliasedFrames.Contains(cb.FrameName) || ctx.FirstAliasLine < ca.Line;
        foreach (var n in commonA)
            CompareColumn(ctx, line, label, n, ta[n], tb[n], ta.RowCount, aliased);
    }

    private static void RowCountFinding(Context ctx, CheckpointResult ca, CheckpointResult cb, List<string> common)
    {
        Table ta = ca.Table, tb = cb.Table;
        var rows = Math.Min(ta.RowCount, tb.RowCount);
        var first = rows;
        for (var r = 0; r < rows && first == rows; r++)
        {
            foreach (var n in common)
            {
                var d = Classify(ta[n].GetValue(r), tb[n].GetValue(r), ctx.Options.ToleranceFor(n));
                if (d is CellDiff.Same or CellDiff.MarkerKind) continue;
                first = r;
                break;
            }
        }
        var g = ctx.Group(FindingKind.Shape, ca.Line, ca.Label, null);
        var reason = "rows: " + Num(ta.RowCount) + " in " + ctx.NameA + ", " + Num(tb.RowCount) + " in " + ctx.NameB
            + "; the first " + Num(first) + " rows agree";
        g.Add(reason, Math.Abs((long)ta.RowCount - tb.RowCount), MigrationHints.RowCount, 0, "row count");
        for (var r = first; r < Math.Max(ta.RowCount, tb.RowCount) && g.WantsSample; r++)
            g.Sample(r, RowText(ta, common, r), RowText(tb, common, r));
    }

    private static string RowText(Table t, List<string> columns, int row)
    {
        if (row >= t.RowCount) return "(no row)";
        var cells = new string[columns.Count];
        for (var i = 0; i < cells.Length; i++) cells[i] = CellText.Display(t[columns[i]].GetValue(row));
        return string.Join(", ", cells);
    }

    private static string TypeHint(Column a, Column b)
    {
        var pair = (a.Type, b.Type);
        if (pair is (ColumnType.Int64, ColumnType.Float64) or (ColumnType.Float64, ColumnType.Int64)) return MigrationHints.IntToFloat;
        if (pair is (ColumnType.Bool, ColumnType.Object) or (ColumnType.Object, ColumnType.Bool)) return MigrationHints.BoolToObject;
        if (pair is (ColumnType.Object, ColumnType.Utf8) or (ColumnType.Utf8, ColumnType.Object))
        {
            var obj = (a as ObjectColumn) ?? (b as ObjectColumn);
            return obj is null || obj.IsStringsOnly ? MigrationHints.StringStorage : MigrationHints.MixedColumn;
        }
        return MigrationHints.OtherType;
    }

    private enum CellDiff
    {
        Same,
        Value,
        MarkerKind,
        NanText,
        ValueVersusMissing,
    }

    private static CellDiff Classify(Value a, Value b, FloatTolerance tolerance)
    {
        if (a.IsMissing && b.IsMissing) return a.Missing == b.Missing ? CellDiff.Same : CellDiff.MarkerKind;
        if (a.IsMissing || b.IsMissing)
        {
            var present = a.IsMissing ? b : a;
            return present.Kind == ValueKind.String && string.Equals(present.String, "nan", StringComparison.Ordinal)
                ? CellDiff.NanText
                : CellDiff.ValueVersusMissing;
        }
        if (a.IsNumber && b.IsNumber) return NumbersEqual(a, b, tolerance) ? CellDiff.Same : CellDiff.Value;
        return a.Equals(b) ? CellDiff.Same : CellDiff.Value;
    }

    private static bool NumbersEqual(Value a, Value b, FloatTolerance tolerance)
    {
        if (a.Kind == ValueKind.Int64 && b.Kind == ValueKind.Int64) return a.Int64 == b.Int64;
        if (a.Kind == ValueKind.Int64 && tolerance.IsExact) return LongEqualsDouble(a.Int64, b.Float64);
        if (b.Kind == ValueKind.Int64 && tolerance.IsExact) return LongEqualsDouble(b.Int64, a.Float64);
        return tolerance.Equal(a.AsDouble, b.AsDouble);
    }

    /// <summary>Exact comparison: a double equals a long only when it is that integer (no rounding of the long).</summary>
    private static bool LongEqualsDouble(long l, double d) =>
        d >= -9.2233720368547758E18 && d < 9.2233720368547758E18 && Math.Floor(d) == d && (long)d == l;

    private static void CompareColumn(Context ctx, int line, string label, string name, Column ca, Column cb, int rows, bool aliased)
    {
        FindingGroup? values = null;
        FindingGroup? missing = null;
        var tolerance = ctx.Options.ToleranceFor(name);
        var anyFloat = ca.Type == ColumnType.Float64 || cb.Type == ColumnType.Float64;
        // The typed pass skips rows that are certainly equal; a tolerance needs every numeric row, so it looks at all.
        var candidates = new List<int>();
        if (!tolerance.IsExact || ctx.Options.GenericOnly)
            for (var r = 0; r < rows; r++) candidates.Add(r);
        else
            CellScan.Candidates(ca, cb, rows, candidates);
        // Reasons repeat for every cell of a column: build each text once.
        var reasons = new Dictionary<int, (string Text, string Hint, int Rank)>();
        var differences = 0;
        foreach (var r in candidates)
        {
            var a = ca.GetValue(r);
            var b = cb.GetValue(r);
            var d = Classify(a, b, tolerance);
            if (d == CellDiff.Same) continue;
            if (d == CellDiff.Value)
            {
                values ??= ctx.Group(FindingKind.Value, line, label, name);
                var numeric = anyFloat && a.IsNumber && b.IsNumber;
                var labels = IsTypeLabel(a) && IsTypeLabel(b);
                var hint = aliased ? MigrationHints.AliasValue : labels ? MigrationHints.TypeLabelValue : numeric ? MigrationHints.FloatValue : MigrationHints.OtherValue;
                values.Add(tolerance.IsExact ? "values differ" : "values differ (beyond the float tolerance)", 1, hint, aliased ? 3 : labels ? 2 : numeric ? 1 : 0, "values differ");
                if (values.WantsSample) values.Sample(r, CellText.Display(a), CellText.Display(b));
                continue;
            }
            missing ??= ctx.Group(FindingKind.Missing, line, label, name);
            var key = ((int)d << 16) | ((int)a.Missing << 8) | (int)b.Missing;
            if (!reasons.TryGetValue(key, out var reason))
            {
                reason = MissingReason(ctx, d, a, b);
                reasons.Add(key, reason);
            }
            missing.Add(reason.Text, 1, reason.Hint, reason.Rank, reason.Text);
            if (reasons.Count > differences)
            {
                // A new reason: record its from/to once (the dictionary above already made the texts unique).
                missing.FromTo(DifferenceName(d, a), DifferenceName(d, b));
                differences = reasons.Count;
            }
            if (missing.WantsSample) missing.Sample(r, CellText.Display(a), CellText.Display(b));
        }
    }

    /// <summary>How one side of a missing difference is named in <see cref="FindingDifference"/>.</summary>
    private static string DifferenceName(CellDiff d, Value v) =>
        v.IsMissing ? ValueText.MissingName(v.Missing) : d == CellDiff.NanText ? "'nan'" : "value";

    /// <summary>A string that is a type label of spec §2.1, as type_of(c) gives it.</summary>
    private static bool IsTypeLabel(Value v) =>
        v.Kind == ValueKind.String && ColumnTypes.TryParseLabel(v.String, out _);

    private static (string Text, string Hint, int Rank) MissingReason(Context ctx, CellDiff d, Value a, Value b) => d switch
    {
        CellDiff.MarkerKind => (ValueText.MissingName(a.Missing) + " in " + ctx.NameA + " where " + ctx.NameB + " has " + ValueText.MissingName(b.Missing), MigrationHints.MarkerKind, 0),
        CellDiff.NanText => (a.IsMissing
            ? ValueText.MissingName(a.Missing) + " in " + ctx.NameA + " where " + ctx.NameB + " has the text 'nan'"
            : "the text 'nan' in " + ctx.NameA + " where " + ctx.NameB + " has " + ValueText.MissingName(b.Missing), MigrationHints.NanText, 3),
        _ => (a.IsMissing
            ? ValueText.MissingName(a.Missing) + " in " + ctx.NameA + " where " + ctx.NameB + " has a value"
            : "a value in " + ctx.NameA + " where " + ctx.NameB + " has " + ValueText.MissingName(b.Missing), MigrationHints.ValueVersusMissing, 2),
    };

    // ---- helpers ----------------------------------------------------------------------------------

    private static bool HasWarning(ModeRun run, int line, string code)
    {
        foreach (var w in run.Warnings)
            if (w.Line == line && string.Equals(w.Code, code, StringComparison.Ordinal)) return true;
        return false;
    }

    private static WriteRecord? FindWrite(ModeRun run, int line)
    {
        foreach (var w in run.Writes)
            if (w.Line == line) return w;
        return null;
    }

    private static List<string> Sorted(IReadOnlyList<string> names)
    {
        var list = new List<string>(names);
        list.Sort(StringComparer.Ordinal);
        return list;
    }

    private static bool SameSet(List<string> a, List<string> b)
    {
        if (a.Count != b.Count) return false;
        for (var i = 0; i < a.Count; i++)
            if (!string.Equals(a[i], b[i], StringComparison.Ordinal)) return false;
        return true;
    }

    private static string SetText(List<string> names)
    {
        if (names.Count == 0) return "{}";
        var quoted = new string[names.Count];
        for (var i = 0; i < quoted.Length; i++) quoted[i] = CellText.Quote(names[i]);
        return "{" + string.Join(", ", quoted) + "}";
    }

    private static string Num(long n) => n.ToString(CultureInfo.InvariantCulture);

    private sealed class NoteOrder : IComparer<(int Line, string Kind)>
    {
        public static NoteOrder Instance { get; } = new();

        public int Compare((int Line, string Kind) x, (int Line, string Kind) y)
        {
            var c = x.Line.CompareTo(y.Line);
            return c != 0 ? c : string.CompareOrdinal(x.Kind, y.Kind);
        }
    }
}
