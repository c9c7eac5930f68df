using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary>
/// The value half of <c>set F.c = EXPR [where COND]</c> (spec §2.2, §2.3): rows selected take the new value,
/// the rest keep the old one (a new column gets missing there). The result type follows the typed-write
/// rule: a number or bool into a string column (or a string into a numeric one) makes the column object under
/// <c>boxed</c> and is <c>E-TYPE-WRITE</c> under <c>arrow</c>; int64 with float64 gives float64; a missing value
/// under <c>nan</c> turns int64 into float64 and bool into object; under <c>null</c> it is a null in a column of
/// unchanged type. A boxed cell keeps the written marker, so the <c>null</c> literal (None) and a missing result
/// (NaN) stay apart under <c>boxed+nan</c>.
/// </summary>
public static class Blending
{
    public static Column Blend(Column? old, Column values, ReadOnlySpan<bool> selected, Mode mode)
    {
        var n = values.Length;
        if (old is not null && old.Length != n) throw new ArgumentException("lengths differ", nameof(old));
        var all = selected.IndexOf(false) < 0;
        var writtenAllMissing = AllSelectedMissing(values, selected);
        if (old is null || KernelSupport.AllMissing(old))
        {
            if (all) return Normalized(values, mode);
        }
        else if (all && !writtenAllMissing)
        {
            // A whole-column write keeps the column when the types agree (columns are immutable: no copy).
            if (old.Type == values.Type && old is not ObjectColumn) return Normalized(values, mode);
            if (old is Float64Column && values is Int64Column) return Casts.Cast(values, ColumnType.Float64, mode);
            if (old is Int64Column && values is Float64Column) return Normalized(values, mode);
        }
        if (old is not null && old.Type == values.Type && old is not ObjectColumn && !writtenAllMissing)
        {
            var fast = SameType(old, values, selected, mode);
            if (fast is not null) return fast;
        }
        // The generic path: decode, unify, rebuild. docs/semantics.md, "Missing values written": None is the
        // marker of a boxed string cell only; a missing value written into a column that holds no string (a
        // bool column, or one of bools and NaN) is NaN.
        var noneIsNaN = mode.IsNan && old is not null && !KernelSupport.AllMissing(old) && !HoldsString(old) && !HoldsString(values, selected);
        var cells = new Value[n];
        for (var i = 0; i < n; i++)
        {
            if (!selected[i])
                cells[i] = old is null ? Value.MissingOf(MissingFor(values, mode)) : old.GetValue(i);
            else
            {
                var v = values.GetValue(i);
                cells[i] = noneIsNaN && v.Missing == MissingKind.NoneRef ? Value.NaN : v;
            }
        }
        ColumnType? hint = old?.Type ?? values.Type;
        if (!KernelSupport.AllMissing(values) && old is not null && KernelSupport.AllMissing(old)) hint = values.Type;
        if (hint == ColumnType.Utf8 && mode.IsBoxed) hint = ColumnType.Object;
        if (hint == ColumnType.Object && mode.IsArrow && (old is null || KernelSupport.IsString(old) || KernelSupport.AllMissing(old))) hint = ColumnType.Utf8;
        if (writtenAllMissing && old is not null && !KernelSupport.AllMissing(old))
        {
            // Only missing values are written: the column keeps its type, widened for a missing cell under nan.
            var t = ColumnFactory.Widen(old.Type, hasMissing: true, mode);
            if (t == ColumnType.Utf8 && mode.IsBoxed) t = ColumnType.Object;
            return ColumnFactory.Build(cells, t, mode);
        }
        var type = ColumnFactory.InferType(cells, mode, hint, ErrorCodes.TypeWrite);
        if (all && old is not null && !KernelSupport.AllMissing(old)) type = WithOld(old, cells, type, mode);
        return ColumnFactory.Build(cells, type, mode);
    }

    /// <summary>
    /// A write of every row still writes into the old column: strings meeting non-strings follow the typed-write
    /// rule (object under boxed, <c>E-TYPE-WRITE</c> under arrow) and an int64 write into float64 stays float64.
    /// </summary>
    private static ColumnType WithOld(Column old, ReadOnlySpan<Value> cells, ColumnType type, Mode mode)
    {
        bool anyString = false, anyOther = false;
        foreach (var v in cells)
        {
            if (v.IsMissing) continue;
            if (v.Kind == ValueKind.String) anyString = true;
            else anyOther = true;
        }
        var oldString = KernelSupport.IsString(old);
        var oldMixed = old is ObjectColumn && !oldString;
        if (!oldMixed && ((oldString && anyOther) || (!oldString && anyString)))
        {
            if (mode.IsArrow)
                throw new EngineException(ErrorCodes.TypeWrite,
                    $"cannot write {(anyString ? "strings" : "non-string values")} into a {old.TypeLabel} column under Arrow string storage");
            return ColumnType.Object;
        }
        if (old.Type == ColumnType.Float64 && type == ColumnType.Int64) return ColumnType.Float64;
        return type;
    }

    /// <summary>True when a cell of <paramref name="c"/> (among <paramref name="selected"/> rows, when given) is a string.</summary>
    private static bool HoldsString(Column c, ReadOnlySpan<bool> selected = default)
    {
        if (c is Utf8Column) return c.MissingCount < c.Length;
        if (c is not ObjectColumn o) return false;
        var cells = o.Cells.Span;
        for (var i = 0; i < cells.Length; i++)
            if (cells[i] is string && (selected.IsEmpty || selected[i])) return true;
        return false;
    }

    private static MissingKind MissingFor(Column c, Mode mode) =>
        mode.IsNull ? MissingKind.Null : c.Type == ColumnType.Timestamp ? MissingKind.NaT : MissingKind.NaN;

    private static bool AllSelectedMissing(Column values, ReadOnlySpan<bool> selected)
    {
        var flags = KernelSupport.MissingFlags(values);
        if (flags is null) return false;
        for (var i = 0; i < selected.Length; i++)
            if (selected[i] && !flags[i]) return false;
        return true;
    }

    /// <summary>A computed column stored as a frame column (an <c>add</c>): O(1) when it already has the §2.1 representation.</summary>
    public static Column Store(Column values, Mode mode) => Normalized(values, mode);

    /// <summary>A whole-column write stores the computed column as it is (columns are immutable), with the §2.1 representation.</summary>
    private static Column Normalized(Column values, Mode mode)
    {
        if (values is Utf8Column && mode.IsBoxed) return Casts.Text(values, mode);
        return ColumnFactory.Normalize(values, mode);
    }

    /// <summary>Typed blends for two columns of one primitive or Arrow string type; null when the generic path is needed.</summary>
    private static Column? SameType(Column old, Column values, ReadOnlySpan<bool> selected, Mode mode)
    {
        var n = values.Length;
        switch (old, values)
        {
            case (Int64Column a, Int64Column b):
            {
                var data = new long[n];
                var missing = Blend(a.Span, b.Span, data, KernelSupport.MissingFlags(a), KernelSupport.MissingFlags(b), selected);
                return KernelSupport.Int(data, missing, mode);
            }
            case (Float64Column a, Float64Column b):
            {
                var data = new double[n];
                var missing = Blend(a.Span, b.Span, data, KernelSupport.MissingFlags(a), KernelSupport.MissingFlags(b), selected);
                return KernelSupport.Float(data, missing, mode);
            }
            case (BoolColumn a, BoolColumn b):
            {
                var data = new bool[n];
                var missing = Blend(a.Span, b.Span, data, KernelSupport.MissingFlags(a), KernelSupport.MissingFlags(b), selected);
                return KernelSupport.Bool(data, missing, mode);
            }
            case (Utf8Column a, Utf8Column b):
            {
                var builder = new Utf8ColumnBuilder(n, a.Data.Length);
                for (var i = 0; i < n; i++)
                {
                    var src = selected[i] ? b : a;
                    if (src.IsMissing(i)) builder.AppendMissing();
                    else builder.Append(src.GetBytes(i));
                }
                return builder.Build(mode.Missing);
            }
            default:
                return null;
        }
    }

    private static bool[]? Blend<T>(ReadOnlySpan<T> a, ReadOnlySpan<T> b, Span<T> dst, bool[]? ma, bool[]? mb, ReadOnlySpan<bool> selected)
        where T : unmanaged
    {
        bool[]? missing = null;
        for (var i = 0; i < dst.Length; i++)
        {
            var s = selected[i];
            dst[i] = s ? b[i] : a[i];
            var m = s ? mb is not null && mb[i] : ma is not null && ma[i];
            if (!m) continue;
            missing ??= new bool[dst.Length];
            missing[i] = true;
        }
        return missing;
    }
}
