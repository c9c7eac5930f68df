using System.Text;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Kernels;
using Parity.Script.Syntax;

namespace Parity.Script.Running.Internal;

internal sealed partial class ScriptRun
{
    /// <summary>
    /// <c>set F.c = EXPR [where COND]</c> and the chained <c>set (DERIVATION).c = ...</c> (spec §2.2, §3.3).
    /// The new values are blended with the old ones, then written through <see cref="Frame.Write"/>, which is
    /// where <c>alias</c> (splice into a shared slot) and <c>cow</c> (a fresh slot) differ. The frames whose
    /// visible contents changed are found by comparing every named frame before and after.
    /// </summary>
    private void Set(SetStatement set)
    {
        Frame target;
        bool copied;
        string frameName;
        if (set.Chain is { } chain)
        {
            (target, copied) = Derive(chain);
            frameName = chain.Source.Name;
        }
        else
        {
            var named = Named(set.Frame!);
            (target, copied, frameName) = (named.Frame, named.DerivedByCopy, named.Name);
        }
        var table = target.Snapshot();
        var values = Eval(set.Value, new Scope(table, frameName));
        var selected = set.Condition is null ? null : Mask(set.Condition, new Scope(table, frameName), "rows not written because the condition was null");
        var i = table.IndexOf(set.Column.Name);
        var old = i >= 0 ? table.Columns[i] : null;
        var blended = Kernel(set.Column, () => selected is null ? Whole(old, values) : Blending.Blend(old, values, selected, _mode));

        var before = Capture();
        Kernel(set.Column, () => target.Write(set.Column.Name, blended, _mode));
        var changed = Changed(before);

        var text = set.Chain is null ? set.Frame!.Name + "." + set.Column.Name : "(" + Render(set.Chain) + ")." + set.Column.Name;
        var line = set.Span.LineNumber;
        var col = set.Span.ColumnNumber;
        if (_mode.IsAlias && copied)
        {
            _run.Warnings.Add(new RunWarning(ErrorCodes.MaybeCopy, line, col,
                $"write into '{text}', a frame made by a copying operation: the write may not reach the frame it came from", changed));
        }
        if (_mode.IsCow && set.Chain is not null)
        {
            _run.Warnings.Add(new RunWarning(ErrorCodes.ChainedWrite, line, col,
                $"chained write '{text}' goes into an unnamed temporary and has no effect under copy-on-write", changed));
        }
        _run.Writes.Add(new WriteRecord(line, col, text, changed));
    }

    private Column Whole(Column? old, Column values)
    {
        var all = new bool[values.Length];
        all.AsSpan().Fill(true);
        return Blending.Blend(old, values, all, _mode);
    }

    /// <summary>Each named frame's columns as (name, slot, data) before a write.</summary>
    private Dictionary<string, (FrameColumn Column, Column Data)[]> Capture()
    {
        var state = new Dictionary<string, (FrameColumn, Column)[]>(_frames.Count, StringComparer.Ordinal);
        foreach (var (name, f) in _frames)
        {
            var cols = f.Frame.Columns;
            var arr = new (FrameColumn, Column)[cols.Count];
            for (var i = 0; i < arr.Length; i++) arr[i] = (cols[i], cols[i].Slot.Data);
            state[name] = arr;
        }
        return state;
    }

    /// <summary>The named frames whose visible contents differ from <paramref name="before"/>, sorted ordinally.</summary>
    private List<string> Changed(Dictionary<string, (FrameColumn Column, Column Data)[]> before)
    {
        var changed = new List<string>();
        foreach (var (name, f) in _frames)
        {
            var old = before[name];
            var now = f.Frame.Columns;
            if (old.Length != now.Count) { changed.Add(name); continue; }
            for (var i = 0; i < old.Length; i++)
            {
                var (fc, data) = old[i];
                var cur = now[i];
                if (ReferenceEquals(cur.Slot, fc.Slot) && ReferenceEquals(cur.Slot.Data, data) && cur.Offset == fc.Offset) continue;
                var was = fc.Offset == 0 && fc.Length == data.Length ? data : data.Slice(fc.Offset, fc.Length);
                if (!string.Equals(cur.Name, fc.Name, StringComparison.Ordinal) || !ColumnEquality.Same(was, cur.Column))
                {
                    changed.Add(name);
                    break;
                }
            }
        }
        changed.Sort(StringComparer.Ordinal);
        return changed;
    }

    /// <summary>A short text of a derivation for write records: <c>tickets where … take 5</c>.</summary>
    private static string Render(Derivation d)
    {
        var sb = new StringBuilder(d.Source.Name);
        foreach (var c in d.Clauses)
        {
            sb.Append(' ');
            sb.Append(c switch
            {
                WhereClause => "where …",
                TakeClause t => "take " + t.Count.ToString(System.Globalization.CultureInfo.InvariantCulture),
                SkipClause s => "skip " + s.Count.ToString(System.Globalization.CultureInfo.InvariantCulture),
                ColumnClause col => "column " + col.Column.Name,
                SelectClause sel => "select " + string.Join(", ", sel.Columns.Select(x => x.Name)),
                RenameClause r => "rename " + string.Join(", ", r.Pairs.Select(p => p.From.Name + " to " + p.To.Name)),
                CastClause cast => "cast " + string.Join(", ", cast.Items.Select(x => x.Column.Name + " to " + x.Target.ToString().ToLowerInvariant())),
                AddClause add => "add " + string.Join(", ", add.Items.Select(x => x.Name.Name + " = …")),
                FillClause fill => "fill " + string.Join(", ", fill.Items.Select(x => x.Name.Name + " with …")),
                DropMissingClause => "drop missing",
                OrderByClause o => "order by " + string.Join(", ", o.Keys.Select(k => k.Column.Name + (k.Descending ? " desc" : ""))),
                GroupByClause g => "group by " + string.Join(", ", g.Keys.Select(k => k.Name)) + " compute …",
                JoinClause j => "join " + j.Other.Name + " on " + j.LeftKey.Name,
                AppendClause a => "append " + a.Other.Name,
                DistinctClause => "distinct",
                _ => "…",
            });
        }
        return sb.ToString();
    }
}
