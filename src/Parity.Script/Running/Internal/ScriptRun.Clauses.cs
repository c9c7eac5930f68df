using System.Globalization;
using SortKey = Parity.Engine.Operations.SortKey;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Kernels;
using Parity.Engine.Operations;
using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Running.Internal;

internal sealed partial class ScriptRun
{
    /// <summary>
    /// Applies a derivation's clauses left to right. Under <c>alias</c> row ranges and <c>column</c> are views
    /// of the frame before them and everything else an eager copy (<see cref="Frame.Derive"/>); under <c>cow</c>
    /// every clause yields a frame of its own that shares unchanged columns. <c>copied</c> says whether a
    /// copying clause took part (or the source was itself made by one).
    /// </summary>
    private (Frame Frame, bool Copied) Derive(Derivation derivation)
    {
        var source = Named(derivation.Source);
        var frame = source.Frame;
        var copied = source.DerivedByCopy;
        var name = source.Name;
        if (derivation.Clauses.Count == 0)
            return (_mode.IsAlias ? frame.View(0, frame.RowCount) : Frame.Derive(frame.Snapshot(), _mode), copied);
        var clauses = derivation.Clauses;
        for (var i = 0; i < clauses.Count; i++)
        {
            var clause = clauses[i];
            copied |= clause is not (TakeClause or SkipClause or ColumnClause);
            if (clause is OrderByClause order && i + 1 < clauses.Count && clauses[i + 1] is TakeClause take)
            {
                // order by ... take N: gather only the first N rows of the permutation instead of the whole
                // sorted frame (a view of which would keep every sorted row alive under alias).
                frame = OrderBy(order, frame.Snapshot(), name, take.Count);
                i++;
                continue;
            }
            frame = Apply(clause, frame, name);
        }
        return (frame, copied);
    }

    private Frame Apply(Clause clause, Frame frame, string name)
    {
        var table = frame.Snapshot();
        switch (clause)
        {
            case WhereClause w:
            {
                var keep = Mask(w.Condition, new Scope(table, name), "rows dropped because the condition was null");
                return Derived(table, Kernel(w, () => TableOps.Filter(table, keep)));
            }
            case TakeClause t:
            {
                var n = (int)Math.Clamp(t.Count, 0, frame.RowCount);
                return Rows(frame, table, 0, n);
            }
            case SkipClause s:
            {
                var skip = (int)Math.Clamp(s.Count, 0, frame.RowCount);
                return Rows(frame, table, skip, frame.RowCount - skip);
            }
            case ColumnClause c:
            {
                RequireColumn(c.Column, table, name);
                if (_mode.IsAlias) return frame.ViewColumn(c.Column.Name);
                return Derived(table, new Table([c.Column.Name], [table[c.Column.Name]], table.RowCount));
            }
            case SelectClause sel:
            {
                var names = new List<string>(sel.Columns.Count);
                var cols = new List<Column>(sel.Columns.Count);
                foreach (var id in sel.Columns)
                {
                    RequireColumn(id, table, name);
                    if (names.Contains(id.Name)) throw Error(ErrorCodes.DupColumn, $"column '{id.Name}' is selected twice", id.Span);
                    names.Add(id.Name);
                    cols.Add(table[id.Name]);
                }
                return Derived(table, new Table(names, cols, table.RowCount));
            }
            case RenameClause r:
            {
                var names = new List<string>(table.Names);
                foreach (var pair in r.Pairs)
                {
                    var i = names.IndexOf(pair.From.Name);
                    if (i < 0) throw UnknownColumn(pair.From, new Table(names, table.Columns, table.RowCount), name);
                    var j = names.IndexOf(pair.To.Name);
                    if (j >= 0 && j != i) throw Error(ErrorCodes.DupColumn, $"frame '{name}' already has a column '{pair.To.Name}'", pair.To.Span);
                    names[i] = pair.To.Name;
                }
                return Derived(table, new Table(names, table.Columns, table.RowCount));
            }
            case CastClause cast:
            {
                var cols = new List<Column>(table.Columns);
                foreach (var item in cast.Items)
                {
                    RequireColumn(item.Column, table, name);
                    var i = table.IndexOf(item.Column.Name);
                    var target = TypeOf(item.Target);
                    var src = cols[i];
                    cols[i] = Kernel(item.Column, () => Casts.Cast(src, target, _mode));
                }
                return Derived(table, new Table(table.Names, cols, table.RowCount));
            }
            case AddClause add:
            {
                var names = new List<string>(table.Names);
                var cols = new List<Column>(table.Columns);
                foreach (var item in add.Items)
                {
                    // Later items see the columns added before them.
                    var current = new Table(names, cols, table.RowCount);
                    var value = Eval(item.Value, new Scope(current, name));
                    var i = names.IndexOf(item.Name.Name);
                    var stored = Kernel(item.Name, () => Blending.Store(value, _mode));
                    if (i >= 0) cols[i] = stored;
                    else
                    {
                        names.Add(item.Name.Name);
                        cols.Add(stored);
                    }
                }
                return Derived(table, new Table(names, cols, table.RowCount));
            }
            case FillClause fill:
            {
                var cols = new List<Column>(table.Columns);
                foreach (var item in fill.Items)
                {
                    RequireColumn(item.Name, table, name);
                    var i = table.IndexOf(item.Name.Name);
                    var old = cols[i];
                    var value = Eval(item.Value, new Scope(table, name));
                    var missing = new bool[table.RowCount];
                    for (var r = 0; r < missing.Length; r++) missing[r] = old.IsMissing(r);
                    cols[i] = Kernel(item.Name, () => Blending.Blend(old, value, missing, _mode));
                }
                return Derived(table, new Table(table.Names, cols, table.RowCount));
            }
            case DropMissingClause drop:
            {
                var names = ColumnList(drop.Columns, table, name);
                return Derived(table, Kernel(drop, () => TableOps.DropMissing(table, names)));
            }
            case OrderByClause order:
                return OrderBy(order, table, name, null);
            case GroupByClause group:
                return Derived(table, Group(group, table, name));
            case JoinClause join:
            {
                var other = Named(join.Other);
                var right = other.Frame.Snapshot();
                var rightKey = join.RightKey ?? join.LeftKey;
                RequireColumn(join.LeftKey, table, name);
                RequireColumn(rightKey, right, other.Name);
                return Derived(table, Kernel(join, () => Joining.Join(table, right, join.LeftKey.Name, rightKey.Name, join.Kind == JoinKind.Left, _mode, _options.MaxRows)));
            }
            case AppendClause append:
            {
                var other = Named(append.Other);
                var bottom = other.Frame.Snapshot();
                if ((long)table.RowCount + bottom.RowCount > _options.MaxRows)
                    throw Error(ErrorCodes.Limit, $"append would make {((long)table.RowCount + bottom.RowCount).ToString(CultureInfo.InvariantCulture)} rows, more than the limit of {_options.MaxRows.ToString(CultureInfo.InvariantCulture)}", append.Span);
                return Derived(table, Kernel(append, () => Appending.Append(table, bottom, _mode)));
            }
            case DistinctClause distinct:
            {
                var names = ColumnList(distinct.Columns, table, name);
                var rows = Kernel(distinct, () => Distinct.FirstRows(table, names));
                return Derived(table, Kernel(distinct, () => TableOps.Gather(table, rows, _mode)));
            }
            default:
                throw Error(ErrorCodes.Internal, "unknown clause", clause.Span);
        }
    }

    /// <summary>A derived frame of <paramref name="result"/>; under <c>alias</c> the columns it shares with <paramref name="input"/> are copied.</summary>
    private Frame Derived(Table input, Table result) => Frame.Derive(result, _mode, input);

    /// <summary>
    /// <c>order by</c>, and with <paramref name="take"/> the <c>take N</c> after it: the same stable permutation
    /// either way, so the rows are exactly those of a full sort followed by <c>take</c>; only the first N are found and
    /// gathered.
    /// </summary>
    private Frame OrderBy(OrderByClause order, Table table, string name, long? take)
    {
        var keys = new List<SortKey>(order.Keys.Count);
        foreach (var k in order.Keys)
        {
            RequireColumn(k.Column, table, name);
            keys.Add(new SortKey(k.Column.Name, k.Descending));
        }
        var perm = Kernel(order, () => take is { } n
            ? Sorting.Permutation(table, keys, (int)Math.Clamp(n, 0, table.RowCount))
            : Sorting.Permutation(table, keys));
        return Derived(table, Kernel(order, () => TableOps.Gather(table, perm, _mode)));
    }

    /// <summary>Rows [offset, offset+length): a view under <c>alias</c>; under <c>cow</c> O(1) slices of the same buffers.</summary>
    private Frame Rows(Frame frame, Table table, int offset, int length)
    {
        if (_mode.IsAlias) return frame.View(offset, length);
        var cols = new Column[table.ColumnCount];
        for (var i = 0; i < cols.Length; i++)
            cols[i] = offset == 0 && length == table.RowCount ? table.Columns[i] : table.Columns[i].Slice(offset, length);
        return Derived(table, new Table(table.Names, cols, length));
    }

    private ColumnType TypeOf(CastTarget target) => target switch
    {
        CastTarget.Int64 => ColumnType.Int64,
        CastTarget.Float64 => ColumnType.Float64,
        CastTarget.Bool => ColumnType.Bool,
        CastTarget.Timestamp => ColumnType.Timestamp,
        _ => _mode.IsArrow ? ColumnType.Utf8 : ColumnType.Object,
    };

    private List<string> ColumnList(IReadOnlyList<Identifier> ids, Table table, string name)
    {
        var names = new List<string>(ids.Count == 0 ? table.ColumnCount : ids.Count);
        if (ids.Count == 0)
        {
            names.AddRange(table.Names);
            return names;
        }
        foreach (var id in ids)
        {
            RequireColumn(id, table, name);
            names.Add(id.Name);
        }
        return names;
    }

    /// <summary>Evaluates a condition into the rows it selects; null rows are not selected and are noted.</summary>
    private bool[] Mask(Expr condition, Scope scope, string what)
    {
        var c = Eval(condition, scope);
        var nulls = 0;
        var keep = Kernel(condition, () => Masks.Select(c, _mode, out nulls));
        if (nulls > 0)
            _run.Notes.Add(new RunNote(RunNote.NullCondition, condition.Span.LineNumber, condition.Span.ColumnNumber, nulls,
                $"{nulls.ToString(CultureInfo.InvariantCulture)} {what}"));
        return keep;
    }

    private Table Group(GroupByClause group, Table table, string name)
    {
        var keys = ColumnList(group.Keys, table, name);
        var gi = Kernel(group, () => Grouping.Group(table, keys));
        if (gi.DroppedRows > 0)
            _run.Notes.Add(new RunNote(RunNote.MissingGroupKey, group.Span.LineNumber, group.Span.ColumnNumber, gi.DroppedRows,
                $"{gi.DroppedRows.ToString(CultureInfo.InvariantCulture)} rows dropped from grouping because a key was missing"));
        var keyTable = Kernel(group, () => Grouping.KeyTable(table, keys, gi, _mode));
        var names = new List<string>(keyTable.Names);
        var cols = new List<Column>(keyTable.Columns);
        var scope = new Scope(table, name, gi, keyTable);
        foreach (var item in group.Computes)
        {
            if (names.Contains(item.Name.Name)) throw Error(ErrorCodes.DupColumn, $"column '{item.Name.Name}' is computed twice", item.Name.Span);
            names.Add(item.Name.Name);
            cols.Add(Eval(item.Value, scope));
        }
        return new Table(names, cols, gi.GroupCount);
    }
}
