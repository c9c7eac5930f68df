using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Columns;

/// <summary>
/// Boxed cells: one managed object per cell (<c>boxed</c> storage). A cell is a <see cref="string"/>, a boxed
/// <see cref="long"/>, <see cref="double"/>, <see cref="bool"/> or <see cref="DateTime"/> (UTC), or a null
/// reference. Under <c>nan</c> a null reference is <c>None</c> and a boxed NaN double is the NaN sentinel;
/// under <c>null</c> a null reference is <c>null</c> and a NaN double is a value.
/// </summary>
public sealed class ObjectColumn : Column, IStringColumn
{
    private int _stringsOnly = -1;

    public ObjectColumn(ReadOnlyMemory<object?> cells, MissingMarker marker)
        : base(cells.Length, marker)
    {
        Cells = cells;
    }

    public ReadOnlyMemory<object?> Cells { get; }

    public override ColumnType Type => ColumnType.Object;

    /// <summary>True when every non-missing cell is a string (a boxed string column rather than a mixed one).</summary>
    public bool IsStringsOnly
    {
        get
        {
            if (_stringsOnly < 0)
            {
                var ok = 1;
                foreach (var c in Cells.Span)
                {
                    if (c is null or string) continue;
                    if (c is double d && double.IsNaN(d) && Marker == MissingMarker.Nan) continue;
                    ok = 0;
                    break;
                }
                _stringsOnly = ok;
            }
            return _stringsOnly == 1;
        }
    }

    public override bool IsMissing(int index) => IsMissingCell(Cells.Span[index], Marker);

    public static bool IsMissingCell(object? cell, MissingMarker marker) =>
        cell is null || (marker == MissingMarker.Nan && cell is double d && double.IsNaN(d));

    public override Value GetValue(int index) => FromCell(Cells.Span[index], Marker);

    /// <summary>Decodes one boxed cell under a missing-value semantics.</summary>
    public static Value FromCell(object? cell, MissingMarker marker) => cell switch
    {
        null => marker == MissingMarker.Nan ? Value.NoneRef : Value.Null,
        string s => Value.Of(s),
        long l => Value.Of(l),
        double d => marker == MissingMarker.Nan && double.IsNaN(d) ? Value.NaN : Value.Of(d),
        bool b => Value.Of(b),
        DateTime t => Value.Timestamp(ValueText.ToMicros(new DateTimeOffset(t, TimeSpan.Zero))),
        _ => Value.Of(cell.ToString() ?? ""),
    };

    /// <summary>Boxes a value for a cell; a missing value becomes a null reference (None/null) or a NaN double.</summary>
    public static object? ToCell(Value v) => v.Kind switch
    {
        ValueKind.String => v.String,
        ValueKind.Int64 => v.Int64,
        ValueKind.Float64 => v.Float64,
        ValueKind.Bool => v.Bool,
        ValueKind.Timestamp => ValueText.FromMicros(v.TimestampMicros),
        _ => v.Missing == MissingKind.NaN || v.Missing == MissingKind.NaT ? double.NaN : null,
    };

    public string GetString(int index) => Cells.Span[index] as string ?? "";

    public override Column Slice(int offset, int length) => new ObjectColumn(Cells.Slice(offset, length), Marker);

    public override Column Clone() => new ObjectColumn(Cells.ToArray(), Marker);

    public override Column Gather(ReadOnlySpan<int> rows)
    {
        var src = Cells.Span;
        var dst = new object?[rows.Length];
        var fill = Marker == MissingMarker.Nan ? (object)double.NaN : null;
        for (var i = 0; i < rows.Length; i++)
            dst[i] = rows[i] >= 0 ? src[rows[i]] : fill;
        return new ObjectColumn(dst, Marker);
    }
}
