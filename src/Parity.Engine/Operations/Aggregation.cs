using System.Text;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Engine.Operations.Internal;

namespace Parity.Engine.Operations;

/// <summary>
/// Aggregates over a <see cref="GroupIndex"/> (spec §2.2, §2.3). Every aggregate skips missing values (any
/// marker; a NaN that is a value under <c>null</c> modes is not skipped). Result types:
/// <list type="bullet">
/// <item><c>count()</c>, <c>count(c)</c>, <c>count_distinct</c>: int64;</item>
/// <item><c>avg</c>: float64 (bools count as 0 and 1); a string or timestamp input is <c>E-AGG-TYPE</c>;</item>
/// <item><c>sum</c>: the input's type: int64 (overflow is <c>E-OVERFLOW</c>), float64, and a boxed string
/// column concatenates in row order; a string column under <c>arrow</c>, a timestamp column, or a mixed column
/// holding strings and numbers is <c>E-AGG-TYPE</c>. Exception: a bool column sums to int64 (the number of
/// true cells), the common practice. A group with no non-missing value sums to 0 (the empty string for
/// boxed strings);</item>
/// <item><c>min</c>, <c>max</c>, <c>first</c>: the input's type, ordered as <see cref="Sorting"/> orders
/// (so under <c>null</c> a NaN value is the max of its group); <c>first</c> is the first non-missing value.</item>
/// </list>
/// A group with no non-missing value gives a missing <c>min</c>/<c>max</c>/<c>first</c>/<c>avg</c>, and the
/// result is then normalised for the mode (under <c>nan</c> int64 becomes float64, bool becomes object).
/// </summary>
public static class Aggregation
{
    public static Column Aggregate(AggregateFunction function, Column? input, GroupIndex groups, Mode mode)
    {
        if (function == AggregateFunction.CountRows) return CountRows(groups, mode);
        ArgumentNullException.ThrowIfNull(input);
        if (input.Length != groups.RowCount) throw new ArgumentException("input length differs from the grouped row count", nameof(input));
        return function switch
        {
            AggregateFunction.Count => Count(input, groups, mode),
            AggregateFunction.Sum => Sum(input, groups, mode),
            AggregateFunction.Avg => Avg(input, groups, mode),
            AggregateFunction.Min => Pick(input, Extreme(input, groups, max: false), mode),
            AggregateFunction.Max => Pick(input, Extreme(input, groups, max: true), mode),
            AggregateFunction.First => Pick(input, FirstRows(input, groups), mode),
            AggregateFunction.CountDistinct => CountDistinct(input, groups, mode),
            _ => throw new ArgumentOutOfRangeException(nameof(function)),
        };
    }

    private static Int64Column CountRows(GroupIndex groups, Mode mode)
    {
        var counts = new long[groups.GroupCount];
        foreach (var g in groups.GroupOf)
            if (g >= 0) counts[g]++;
        return new Int64Column(counts, mode.Missing);
    }

    private static Int64Column Count(Column input, GroupIndex groups, Mode mode)
    {
        var missing = new bool[input.Length];
        ColumnRanker.MarkMissing(input, missing);
        var counts = new long[groups.GroupCount];
        var groupOf = groups.GroupOf;
        for (var i = 0; i < groupOf.Length; i++)
        {
            var g = groupOf[i];
            if (g >= 0 && !missing[i]) counts[g]++;
        }
        return new Int64Column(counts, mode.Missing);
    }

    private static Int64Column CountDistinct(Column input, GroupIndex groups, Mode mode)
    {
        var ranks = ColumnRanker.Rank(input);
        var r = ranks.Ranks;
        var vc = (long)ranks.ValueCount;
        var counts = new long[groups.GroupCount];
        var groupOf = groups.GroupOf;
        var space = groups.GroupCount * vc;
        if (space <= Math.Min((long)r.Length * 2 + 1024, Array.MaxLength))
        {
            var seen = new bool[space];
            for (var i = 0; i < r.Length; i++)
            {
                var g = groupOf[i];
                if (g < 0 || r[i] < 0) continue;
                var key = g * vc + r[i];
                if (seen[key]) continue;
                seen[key] = true;
                counts[g]++;
            }
        }
        else
        {
            var set = new LongIdMap();
            for (var i = 0; i < r.Length; i++)
            {
                var g = groupOf[i];
                if (g < 0 || r[i] < 0) continue;
                var before = set.Count;
                set.GetOrAdd(g * vc + r[i]);
                if (set.Count != before) counts[g]++;
            }
        }
        return new Int64Column(counts, mode.Missing);
    }

    private static Column Sum(Column input, GroupIndex groups, Mode mode)
    {
        var groupOf = groups.GroupOf;
        var gc = groups.GroupCount;
        switch (input)
        {
            case Int64Column ic:
            {
                var sums = new long[gc];
                var span = ic.Span;
                var v = ic.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                var overflow = false;
                for (var i = 0; i < span.Length; i++)
                {
                    var g = groupOf[i];
                    if (g < 0 || !ValidBits.IsValid(vb, vo, i)) continue;
                    var a = sums[g];
                    var b = span[i];
                    var s = unchecked(a + b);
                    overflow |= ((a ^ s) & (b ^ s)) < 0;
                    sums[g] = s;
                }
                if (overflow) throw new EngineException(ErrorCodes.Overflow, "sum overflows int64");
                return new Int64Column(sums, mode.Missing);
            }
            case Float64Column fc:
            {
                var sums = new double[gc];
                var span = fc.Span;
                var v = fc.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                var nanIsMissing = fc.Marker == MissingMarker.Nan;
                for (var i = 0; i < span.Length; i++)
                {
                    var g = groupOf[i];
                    if (g < 0 || !ValidBits.IsValid(vb, vo, i)) continue;
                    var d = span[i];
                    if (nanIsMissing && double.IsNaN(d)) continue;
                    sums[g] += d;
                }
                return new Float64Column(sums, mode.Missing);
            }
            case BoolColumn bc:
            {
                var sums = new long[gc];
                var span = bc.Span;
                var v = bc.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                for (var i = 0; i < span.Length; i++)
                {
                    var g = groupOf[i];
                    if (g >= 0 && span[i] && ValidBits.IsValid(vb, vo, i)) sums[g]++;
                }
                return new Int64Column(sums, mode.Missing);
            }
            case Utf8Column uc:
            {
                if (mode.IsArrow) throw StringSum("utf8");
                var parts = ConcatUtf8(uc, groups);
                var b = new Utf8ColumnBuilder(gc, 0);
                foreach (var p in parts) b.Append(p);
                return b.Build(mode.Missing);
            }
            case ObjectColumn oc:
                return SumCells(oc, groups, mode);
            default:
                throw new EngineException(ErrorCodes.AggType, $"sum is not defined for a {input.TypeLabel} column");
        }
    }

    private static EngineException StringSum(string label) =>
        new(ErrorCodes.AggType, $"sum of a string column ({label}) is not defined under arrow string storage; strings do not add up");

    private static string[] ConcatUtf8(Utf8Column column, GroupIndex groups)
    {
        var builders = new StringBuilder?[groups.GroupCount];
        var groupOf = groups.GroupOf;
        for (var i = 0; i < column.Length; i++)
        {
            var g = groupOf[i];
            if (g < 0 || column.IsMissing(i)) continue;
            (builders[g] ??= new StringBuilder()).Append(column.GetString(i));
        }
        var result = new string[builders.Length];
        for (var g = 0; g < result.Length; g++) result[g] = builders[g]?.ToString() ?? "";
        return result;
    }

    private static ObjectColumn SumCells(ObjectColumn column, GroupIndex groups, Mode mode)
    {
        var cells = column.Cells.Span;
        var marker = column.Marker;
        bool anyString = false, anyNumber = false, anyDouble = false;
        for (var i = 0; i < cells.Length; i++)
        {
            var c = cells[i];
            if (ObjectColumn.IsMissingCell(c, marker) || groups.GroupOf[i] < 0) continue;
            switch (c)
            {
                case string: anyString = true; break;
                case long or bool: anyNumber = true; break;
                case double: anyNumber = true; anyDouble = true; break;
                default:
                    throw new EngineException(ErrorCodes.AggType, "sum is not defined for timestamps (in an object column)");
            }
        }
        if (anyString && anyNumber)
            throw new EngineException(ErrorCodes.AggType, "sum of an object column that mixes strings and numbers");
        var gc = groups.GroupCount;
        var groupOf = groups.GroupOf;
        var result = new object?[gc];
        if (anyNumber)
        {
            var longs = new long[gc];
            var doubles = new double[gc];
            var overflow = false;
            for (var i = 0; i < cells.Length; i++)
            {
                var g = groupOf[i];
                var c = cells[i];
                if (g < 0 || ObjectColumn.IsMissingCell(c, marker)) continue;
                switch (c)
                {
                    case double d: doubles[g] += d; break;
                    default:
                    {
                        var b = c is long l ? l : (bool)c! ? 1L : 0L;
                        var a = longs[g];
                        var s = unchecked(a + b);
                        overflow |= ((a ^ s) & (b ^ s)) < 0;
                        longs[g] = s;
                        break;
                    }
                }
            }
            if (overflow && !anyDouble) throw new EngineException(ErrorCodes.Overflow, "sum overflows int64");
            for (var g = 0; g < gc; g++) result[g] = anyDouble ? doubles[g] + longs[g] : longs[g];
            return new ObjectColumn(result, mode.Missing);
        }
        if (anyString && mode.IsArrow) throw StringSum("object");
        var builders = new StringBuilder?[gc];
        for (var i = 0; i < cells.Length; i++)
        {
            var g = groupOf[i];
            if (g < 0 || cells[i] is not string s) continue;
            (builders[g] ??= new StringBuilder()).Append(s);
        }
        // Spec §2.3: a sum over no non-missing value is the empty string for boxed strings.
        for (var g = 0; g < gc; g++) result[g] = (object?)builders[g]?.ToString() ?? (mode.IsBoxed ? "" : 0L);
        return new ObjectColumn(result, mode.Missing);
    }

    private static Float64Column Avg(Column input, GroupIndex groups, Mode mode)
    {
        var gc = groups.GroupCount;
        var sums = new double[gc];
        var counts = new long[gc];
        var groupOf = groups.GroupOf;
        switch (input)
        {
            case Int64Column ic:
            {
                var span = ic.Span;
                var v = ic.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                for (var i = 0; i < span.Length; i++)
                {
                    var g = groupOf[i];
                    if (g < 0 || !ValidBits.IsValid(vb, vo, i)) continue;
                    sums[g] += span[i];
                    counts[g]++;
                }
                break;
            }
            case Float64Column fc:
            {
                var span = fc.Span;
                var v = fc.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                var nanIsMissing = fc.Marker == MissingMarker.Nan;
                for (var i = 0; i < span.Length; i++)
                {
                    var g = groupOf[i];
                    if (g < 0 || !ValidBits.IsValid(vb, vo, i)) continue;
                    var d = span[i];
                    if (nanIsMissing && double.IsNaN(d)) continue;
                    sums[g] += d;
                    counts[g]++;
                }
                break;
            }
            case BoolColumn bc:
            {
                var span = bc.Span;
                var v = bc.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                for (var i = 0; i < span.Length; i++)
                {
                    var g = groupOf[i];
                    if (g < 0 || !ValidBits.IsValid(vb, vo, i)) continue;
                    if (span[i]) sums[g] += 1;
                    counts[g]++;
                }
                break;
            }
            case ObjectColumn oc:
            {
                var cells = oc.Cells.Span;
                for (var i = 0; i < cells.Length; i++)
                {
                    var g = groupOf[i];
                    var c = cells[i];
                    if (g < 0 || ObjectColumn.IsMissingCell(c, oc.Marker)) continue;
                    sums[g] += c switch
                    {
                        long l => l,
                        double d => d,
                        bool b => b ? 1 : 0,
                        _ => throw new EngineException(ErrorCodes.AggType, "avg is not defined for an object column holding strings or timestamps"),
                    };
                    counts[g]++;
                }
                break;
            }
            default:
                throw new EngineException(ErrorCodes.AggType, $"avg is not defined for a {input.TypeLabel} column");
        }
        var valid = new bool[gc];
        for (var g = 0; g < gc; g++)
        {
            valid[g] = counts[g] > 0;
            sums[g] = valid[g] ? sums[g] / counts[g] : double.NaN;
        }
        // Under nan the NaN itself is the missing marker; under null the validity bitmap is.
        return mode.IsNan
            ? new Float64Column(sums, mode.Missing)
            : new Float64Column(sums, Validity.FromFlags(valid), mode.Missing);
    }

    /// <summary>Gathers the chosen rows (-1: the group has no non-missing value) and normalises for the mode.</summary>
    private static Column Pick(Column input, int[] rows, Mode mode)
    {
        var gathered = Gatherer.Gather(input, rows);
        return rows.AsSpan().IndexOf(-1) >= 0 ? ColumnFactory.Normalize(gathered, mode) : gathered;
    }

    private static int[] FirstRows(Column input, GroupIndex groups)
    {
        var missing = new bool[input.Length];
        ColumnRanker.MarkMissing(input, missing);
        var first = new int[groups.GroupCount];
        first.AsSpan().Fill(-1);
        var groupOf = groups.GroupOf;
        for (var i = 0; i < groupOf.Length; i++)
        {
            var g = groupOf[i];
            if (g >= 0 && !missing[i] && first[g] < 0) first[g] = i;
        }
        return first;
    }

    /// <summary>The row holding each group's min or max (ties: the first such row), in <see cref="Sorting"/>'s order.</summary>
    private static int[] Extreme(Column input, GroupIndex groups, bool max)
    {
        var win = new int[groups.GroupCount];
        win.AsSpan().Fill(-1);
        var groupOf = groups.GroupOf;
        switch (input)
        {
            case Int64Column or TimestampColumn:
            {
                var p = (PrimitiveColumn<long>)input;
                var span = p.Span;
                var v = p.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                for (var i = 0; i < span.Length; i++)
                {
                    var g = groupOf[i];
                    if (g < 0 || !ValidBits.IsValid(vb, vo, i)) continue;
                    var w = win[g];
                    if (w < 0 || (max ? span[i] > span[w] : span[i] < span[w])) win[g] = i;
                }
                return win;
            }
            case Float64Column fc:
            {
                var span = fc.Span;
                var v = fc.Validity;
                var vb = v.Bits.Span;
                var vo = v.BitOffset;
                var nanIsMissing = fc.Marker == MissingMarker.Nan;
                for (var i = 0; i < span.Length; i++)
                {
                    var g = groupOf[i];
                    if (g < 0 || !ValidBits.IsValid(vb, vo, i)) continue;
                    var d = span[i];
                    if (nanIsMissing && double.IsNaN(d)) continue;
                    var w = win[g];
                    if (w < 0) { win[g] = i; continue; }
                    var c = CellOrder.CompareDoubles(d, span[w]);
                    if (max ? c > 0 : c < 0) win[g] = i;
                }
                return win;
            }
            default:
            {
                var ranks = ColumnRanker.Rank(input);
                var r = ranks.Ranks;
                for (var i = 0; i < r.Length; i++)
                {
                    var g = groupOf[i];
                    if (g < 0 || r[i] < 0) continue;
                    var w = win[g];
                    if (w < 0 || (max ? r[i] > r[w] : r[i] < r[w])) win[g] = i;
                }
                return win;
            }
        }
    }
}
