using System.Globalization;
using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Operations.Internal;

namespace Parity.Engine.Operations;

/// <summary>
/// <c>join</c> (spec §2.2, §2.3): a hash join on one key column per side. Left rows keep their order and,
/// for each, the matching right rows follow in their order. The key appears once, named and valued as the
/// left key; any other right column whose name is taken gets the suffix <c>_2</c> (then <c>_3</c>, … if
/// that is taken too). Key equality: numbers by value (an int64 key matches a float64 key of equal value;
/// -0.0 matches 0.0; a NaN that is a value matches a NaN value), strings by bytes, mixed cells as in grouping.
/// A missing key (any marker) matches another missing key under <c>nan</c> and never under <c>null</c>.
/// </summary>
public static class Joining
{
    public static Table Join(Table left, Table right, string leftKey, string rightKey, bool leftOuter, Mode mode, long maxRows)
    {
        var li = left.IndexOf(leftKey);
        if (li < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{leftKey}' in the left frame");
        var ri = right.IndexOf(rightKey);
        if (ri < 0) throw new EngineException(ErrorCodes.UnknownColumn, $"no column '{rightKey}' in the right frame");

        var codeCount = JoinKeys.Codes(left.Columns[li], right.Columns[ri], mode, out var leftCodes, out var rightCodes);

        // Right rows bucketed by code, each bucket in right-row order (a stable counting sort).
        var starts = new int[codeCount + 1];
        foreach (var c in rightCodes)
            if (c >= 0) starts[c + 1]++;
        for (var c = 0; c < codeCount; c++) starts[c + 1] += starts[c];
        var byCode = new int[starts[codeCount]];
        var fill = starts.AsSpan(0, codeCount).ToArray();
        for (var r = 0; r < rightCodes.Length; r++)
        {
            var c = rightCodes[r];
            if (c >= 0) byCode[fill[c]++] = r;
        }

        // Count before allocating, so an exploding join fails fast.
        long total = 0;
        foreach (var c in leftCodes)
        {
            var k = c >= 0 ? starts[c + 1] - starts[c] : 0;
            total += k == 0 && leftOuter ? 1 : k;
        }
        var limit = Math.Min(maxRows, Array.MaxLength);
        if (total > limit)
        {
            throw new EngineException(ErrorCodes.Limit, string.Create(CultureInfo.InvariantCulture,
                $"join would produce {total} rows, more than the limit of {limit} (raise it with --max-rows)"));
        }

        var leftRows = new int[total];
        var rightRows = new int[total];
        var o = 0;
        var unmatched = false;
        for (var l = 0; l < leftCodes.Length; l++)
        {
            var c = leftCodes[l];
            var from = c >= 0 ? starts[c] : 0;
            var to = c >= 0 ? starts[c + 1] : 0;
            if (from == to)
            {
                if (!leftOuter) continue;
                leftRows[o] = l;
                rightRows[o++] = -1;
                unmatched = true;
                continue;
            }
            for (var k = from; k < to; k++)
            {
                leftRows[o] = l;
                rightRows[o++] = byCode[k];
            }
        }

        // Every left row once and in order (each key matched exactly once): the left columns are the result's
        // as they are. Columns are immutable, so sharing them is safe in every mode.
        var identity = total == left.RowCount;
        for (var i = 0; identity && i < leftRows.Length; i++) identity = leftRows[i] == i;

        var names = new List<string>(left.ColumnCount + right.ColumnCount);
        var columns = new List<Column>(names.Capacity);
        var taken = new HashSet<string>(StringComparer.Ordinal);
        for (var c = 0; c < left.ColumnCount; c++)
        {
            names.Add(left.Names[c]);
            taken.Add(left.Names[c]);
            columns.Add(identity ? left.Columns[c] : Gatherer.Gather(left.Columns[c], leftRows));
        }
        for (var c = 0; c < right.ColumnCount; c++)
        {
            if (c == ri) continue;
            var name = right.Names[c];
            if (taken.Contains(name))
            {
                var suffix = 2;
                while (taken.Contains(name + "_" + suffix.ToString(CultureInfo.InvariantCulture))) suffix++;
                name = name + "_" + suffix.ToString(CultureInfo.InvariantCulture);
            }
            taken.Add(name);
            names.Add(name);
            var gathered = Gatherer.Gather(right.Columns[c], rightRows);
            columns.Add(unmatched ? ColumnFactory.Normalize(gathered, mode) : gathered);
        }
        return new Table(names, columns, (int)total);
    }
}
