using System.Text;
using Apache.Arrow;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Columns;

/// <summary>
/// Strings as one Arrow UTF-8 array (<c>arrow</c> storage): int32 offsets (n+1, absolute into the data
/// buffer even for a slice), data bytes and a validity bitmap. Kernels read the spans; a cell is decoded
/// to a managed string only when asked.
/// </summary>
public sealed class Utf8Column : Column, IStringColumn
{
    public Utf8Column(StringArray array, MissingMarker marker)
        : base(array.Length, marker)
    {
        Array = array;
    }

    public StringArray Array { get; }

    public override ColumnType Type => ColumnType.Utf8;

    /// <summary>Offsets of this column's slots: <c>Length + 1</c> entries, absolute into <see cref="Data"/>.</summary>
    public ReadOnlySpan<int> Offsets => Array.ValueOffsets;

    /// <summary>The whole data buffer (a slice still points into its parent's buffer).</summary>
    public ReadOnlySpan<byte> Data => Array.Values;

    public ReadOnlySpan<byte> GetBytes(int index) => Array.GetBytes(index);

    public override bool IsMissing(int index) => Array.IsNull(index);

    public override int MissingCount => Array.NullCount;

    public string GetString(int index) => Encoding.UTF8.GetString(Array.GetBytes(index));

    public override Value GetValue(int index) =>
        Array.IsNull(index) ? Value.MissingOf(MissingKindOf) : Value.Of(GetString(index));

    public override Column Slice(int offset, int length) =>
        new Utf8Column((StringArray)Array.Slice(offset, length), Marker);

    public override Column Clone()
    {
        var offsets = Offsets;
        var start = offsets[0];
        var bytes = Data.Slice(start, offsets[Length] - start).ToArray();
        var newOffsets = new int[Length + 1];
        for (var i = 0; i <= Length; i++) newOffsets[i] = offsets[i] - start;
        return Utf8ColumnBuilder.FromBuffers(newOffsets, bytes, CopyValidity(), Marker);
    }

    public override Column Gather(ReadOnlySpan<int> rows)
    {
        var b = new Utf8ColumnBuilder(rows.Length, 0);
        for (var i = 0; i < rows.Length; i++)
        {
            var r = rows[i];
            if (r < 0 || Array.IsNull(r)) b.AppendMissing();
            else b.Append(Array.GetBytes(r));
        }
        return b.Build(Marker);
    }

    private Validity CopyValidity()
    {
        if (Array.NullCount == 0) return Validity.AllValid(Length);
        var bits = new byte[(Length + 7) >> 3];
        for (var i = 0; i < Length; i++)
            if (!Array.IsNull(i)) bits[i >> 3] |= (byte)(1 << (i & 7));
        return new Validity(bits, 0, Length);
    }
}
