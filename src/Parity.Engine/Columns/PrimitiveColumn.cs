using Parity.Engine.Modes;

namespace Parity.Engine.Columns;

/// <summary>A fixed-width column: one value buffer and a validity bitmap, both sliceable without copying.</summary>
public abstract class PrimitiveColumn<T> : Column
    where T : unmanaged
{
    protected PrimitiveColumn(ReadOnlyMemory<T> values, Validity validity, MissingMarker marker)
        : base(values.Length, marker)
    {
        if (validity.Length != values.Length)
            throw new ArgumentException("validity length differs from value count", nameof(validity));
        Values = values;
        Validity = validity;
    }

    public ReadOnlyMemory<T> Values { get; }

    public Validity Validity { get; }

    public ReadOnlySpan<T> Span => Values.Span;

    public override bool IsMissing(int index) => !Validity.IsValid(index);

    public override int MissingCount => Validity.NullCount;

    protected abstract PrimitiveColumn<T> With(ReadOnlyMemory<T> values, Validity validity);

    public override Column Slice(int offset, int length) =>
        With(Values.Slice(offset, length), Validity.Slice(offset, length));

    public override Column Clone()
    {
        var copy = Values.ToArray();
        var v = Validity.HasBitmap ? Validity.Compact() : Validity;
        if (v.HasBitmap) v = new Validity(v.Bits.ToArray(), v.BitOffset, v.Length);
        return With(copy, v);
    }

    public override Column Gather(ReadOnlySpan<int> rows)
    {
        var src = Values.Span;
        var dst = new T[rows.Length];
        byte[]? bits = null;
        if (!Validity.HasBitmap)
        {
            // No bitmap: only a -1 row can be missing, so the loop reads no validity.
            for (var i = 0; i < rows.Length; i++)
            {
                var r = rows[i];
                if (r >= 0)
                {
                    dst[i] = src[r];
                    continue;
                }
                bits ??= InitAllValid(rows.Length);
                bits[i >> 3] &= (byte)~(1 << (i & 7));
            }
            return With(dst, bits is null ? Validity.AllValid(rows.Length) : new Validity(bits, 0, rows.Length));
        }
        for (var i = 0; i < rows.Length; i++)
        {
            var r = rows[i];
            if (r >= 0 && Validity.IsValid(r))
            {
                dst[i] = src[r];
                continue;
            }
            bits ??= InitAllValid(rows.Length);
            bits[i >> 3] &= (byte)~(1 << (i & 7));
        }
        return With(dst, bits is null ? Validity.AllValid(rows.Length) : new Validity(bits, 0, rows.Length));
    }

    internal static byte[] InitAllValid(int length)
    {
        var bits = new byte[(length + 7) >> 3];
        bits.AsSpan().Fill(0xFF);
        return bits;
    }
}
