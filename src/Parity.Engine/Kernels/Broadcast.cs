using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Engine.Kernels;

/// <summary>Literals as columns of a frame's row count.</summary>
public static class Broadcast
{
    /// <summary>
    /// A literal repeated <paramref name="rows"/> times. The <c>null</c> literal becomes an all-missing string
    /// column in the mode's storage: under <c>boxed+nan</c> its cells are null references (<c>None</c>, the
    /// marker legacy stacks keep apart from NaN), under <c>arrow</c> null slots (shown NaN under <c>nan</c>).
    /// An all-missing column fits any type in the kernels and in writes.
    /// </summary>
    public static Column Literal(Value value, int rows, Mode mode)
    {
        switch (value.Kind)
        {
            case ValueKind.Int64:
            {
                var d = new long[rows];
                d.AsSpan().Fill(value.Int64);
                return new Int64Column(d, mode.Missing);
            }
            case ValueKind.Float64:
            {
                var d = new double[rows];
                d.AsSpan().Fill(value.Float64);
                return new Float64Column(d, mode.Missing);
            }
            case ValueKind.Bool:
            {
                var d = new bool[rows];
                d.AsSpan().Fill(value.Bool);
                return new BoolColumn(d, mode.Missing);
            }
            case ValueKind.Timestamp:
            {
                var d = new long[rows];
                d.AsSpan().Fill(value.TimestampMicros);
                return new TimestampColumn(d, Validity.AllValid(rows), mode.Missing);
            }
            case ValueKind.String:
                return Strings(value.String, rows, mode);
            default:
                return Missing(rows, mode);
        }
    }

    /// <summary>A string repeated: one shared reference per boxed cell, or one Arrow array with repeated bytes.</summary>
    public static Column Strings(string s, int rows, Mode mode)
    {
        if (mode.IsBoxed)
        {
            var cells = new object?[rows];
            cells.AsSpan().Fill(s);
            return new ObjectColumn(cells, mode.Missing);
        }
        var bytes = System.Text.Encoding.UTF8.GetBytes(s);
        var data = new byte[checked(bytes.Length * rows)];
        var offsets = new int[rows + 1];
        for (var i = 0; i < rows; i++)
        {
            bytes.CopyTo(data, i * bytes.Length);
            offsets[i + 1] = (i + 1) * bytes.Length;
        }
        return Utf8ColumnBuilder.FromBuffers(offsets, data, Validity.AllValid(rows), mode.Missing);
    }

    /// <summary>An all-missing string column (the <c>null</c> literal).</summary>
    public static Column Missing(int rows, Mode mode)
    {
        if (mode.IsBoxed) return new ObjectColumn(new object?[rows], mode.Missing);
        var bits = new byte[(rows + 7) >> 3];
        return Utf8ColumnBuilder.FromBuffers(new int[rows + 1], Array.Empty<byte>(), rows == 0 ? Validity.AllValid(0) : new Validity(bits, 0, rows), mode.Missing, rows);
    }
}
