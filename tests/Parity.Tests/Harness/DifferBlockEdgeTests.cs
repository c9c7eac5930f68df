using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;
using static Parity.Tests.Harness.HarnessFixtures;

namespace Parity.Tests.Harness;

/// <summary>
/// The differ skips blocks whose buffers are byte-equal. These tables span several blocks (4,096 rows) and
/// place differences at block edges, so a wrong skip loses a finding. The expected counts come from an
/// independent cell-by-cell walk of the two columns.
/// </summary>
public sealed class DifferBlockEdgeTests
{
    private const int Rows = 10_000;
    private static readonly int[] Edges = [0, 4095, 4096, 8191, 8192, Rows - 1];

    private static long[] Longs()
    {
        var d = new long[Rows];
        for (var i = 0; i < Rows; i++) d[i] = i * 7L - 3;
        return d;
    }

    private static IReadOnlyList<Finding> Diff(Mode ma, Column a, Mode mb, Column b) =>
        ModeDiffer.Compare(Run(ma, ("big", new Table(["c"], [a], a.Length))), Run(mb, ("big", new Table(["c"], [b], b.Length))), "ferry/big.parity", DiffOptions.Default);

    /// <summary>Rows whose cells do not display the same: the oracle, without the differ's code.</summary>
    private static int CellsDiffering(Column a, Column b)
    {
        var n = 0;
        for (var i = 0; i < a.Length; i++)
            if (!a.GetValue(i).Equals(b.GetValue(i))) n++;
        return n;
    }

    private static int Count(IReadOnlyList<Finding> findings, FindingKind kind)
    {
        var n = 0;
        foreach (var f in findings)
            if (f.Kind == kind) n += f.Count;
        return n;
    }

    // Spec §5: value findings count every differing cell, wherever it sits in a block.
    [Fact]
    public void Int64_differences_at_block_edges_are_all_found()
    {
        var x = Longs();
        var y = Longs();
        foreach (var e in Edges) y[e] += 1;
        var a = new Int64Column(x, MissingMarker.Null);
        var b = new Int64Column(y, MissingMarker.Null);
        var findings = Diff(Mode.Modern, a, Mode.Modern, b);
        Assert.Equal(CellsDiffering(a, b), Count(findings, FindingKind.Value));
        Assert.Equal(Edges.Length, Count(findings, FindingKind.Value));
        Assert.Equal(0, findings.Single().Samples[0].Row);
    }

    // IEEE 754: -0.0 equals 0.0 though the bits differ; a NaN value equals a NaN value (spec §2.1, null modes).
    [Fact]
    public void Float_bits_that_differ_but_values_agree_give_no_finding()
    {
        var x = new double[Rows];
        var y = new double[Rows];
        for (var i = 0; i < Rows; i++) x[i] = y[i] = i * 0.5;
        x[4096] = 0.0;
        y[4096] = -0.0;
        x[9000] = double.NaN;
        y[9000] = BitConverter.Int64BitsToDouble(unchecked((long)0xFFF8_0000_0000_0001UL)); // another NaN payload
        var findings = Diff(Mode.Modern, new Float64Column(x, MissingMarker.Null), Mode.Modern, new Float64Column(y, MissingMarker.Null));
        Assert.Empty(findings);
    }

    // Spec §5 finding kind missing: a value against a missing cell, found though the value bytes are equal.
    [Fact]
    public void Validity_difference_with_equal_values_is_found()
    {
        var bits = new byte[(Rows + 7) >> 3];
        bits.AsSpan().Fill(0xFF);
        bits[4100 >> 3] &= unchecked((byte)~(1 << (4100 & 7)));
        var a = new Int64Column(Longs(), MissingMarker.Null);
        var b = new Int64Column(Longs(), new Validity(bits, 0, Rows), MissingMarker.Null);
        var findings = Diff(Mode.Modern, a, Mode.Modern, b);
        Assert.Equal(1, Count(findings, FindingKind.Missing));
        Assert.Equal(4100, findings.Single().Samples[0].Row);
    }

    // Arrow columnar format: offsets are absolute, so equal strings may sit at different offsets (a slice) and
    // the bitmap of a slice may start mid-byte. Strings include non-ASCII and empty cells.
    [Fact]
    public void Utf8_slices_with_other_offsets_compare_by_cells()
    {
        var cells = new string?[Rows + 13];
        for (var i = 0; i < cells.Length; i++) cells[i] = i % 11 == 0 ? null : i % 7 == 0 ? "" : (i % 3 == 0 ? "Zoë " : "山田 ") + i.ToString(System.Globalization.CultureInfo.InvariantCulture);
        var whole = Build(cells);
        var slice = whole.Slice(13, Rows);
        var fresh = Build(cells.AsSpan(13).ToArray());
        Assert.Empty(Diff(Mode.Modern, slice, Mode.Modern, fresh));

        var changed = (string?[])cells.AsSpan(13).ToArray().Clone();
        changed[4095] = "Σοφία";
        changed[4096] = null;
        changed[Rows - 1] = changed[Rows - 1] + "!";
        var other = Build(changed);
        var findings = Diff(Mode.Modern, slice, Mode.Modern, other);
        Assert.Equal(CellsDiffering(slice, other), Count(findings, FindingKind.Value) + Count(findings, FindingKind.Missing));
        Assert.Equal(3, Count(findings, FindingKind.Value) + Count(findings, FindingKind.Missing));
    }

    // Spec §2.1: an int64 column without missing cells reads the same under both markers; with a missing cell
    // the markers differ (NaN against null), so the cell comparison must still see it.
    [Fact]
    public void Markers_matter_only_where_cells_are_missing()
    {
        var a = new Int64Column(Longs(), MissingMarker.Nan);
        var b = new Int64Column(Longs(), MissingMarker.Null);
        Assert.Empty(Diff(Mode.Legacy, a, Mode.Modern, b));

        var fa = new Float64Column(new double[Rows], MissingMarker.Nan);
        var y = new double[Rows];
        y[5000] = double.NaN; // a NaN value under null, the missing sentinel under nan
        var fb = new Float64Column(y, MissingMarker.Null);
        var findings = Diff(Mode.Legacy, fa, Mode.Modern, fb);
        Assert.Equal(1, Count(findings, FindingKind.Value) + Count(findings, FindingKind.Missing));
    }

    // Boxed cells: equal strings in distinct objects are the same cell; a None against a null is not (spec §2.1).
    [Fact]
    public void Boxed_cells_compare_by_value()
    {
        var x = new object?[Rows];
        var y = new object?[Rows];
        for (var i = 0; i < Rows; i++)
        {
            x[i] = "Åsa " + i.ToString(System.Globalization.CultureInfo.InvariantCulture);
            y[i] = new string(((string)x[i]!).AsSpan());
        }
        x[4097] = 5L;
        y[4097] = 5.0;
        Assert.Empty(Diff(Mode.Legacy, new ObjectColumn(x, MissingMarker.Nan), Mode.Legacy, new ObjectColumn(y, MissingMarker.Nan)));
        y[6000] = null;
        var findings = Diff(Mode.Legacy, new ObjectColumn(x, MissingMarker.Nan), Mode.Legacy, new ObjectColumn(y, MissingMarker.Nan));
        Assert.Equal(1, Count(findings, FindingKind.Missing));
    }

    private static Utf8Column Build(string?[] cells)
    {
        var b = new Utf8ColumnBuilder(cells.Length, cells.Length * 8);
        foreach (var c in cells)
        {
            if (c is null) b.AppendMissing();
            else b.Append(c);
        }
        return b.Build(MissingMarker.Null);
    }
}
