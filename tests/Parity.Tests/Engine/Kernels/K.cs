using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Engine.Kernels;

/// <summary>Column builders for kernel tests.</summary>
internal static class K
{
    public static Column Col(Mode mode, params object?[] cells)
    {
        var v = new Value[cells.Length];
        for (var i = 0; i < v.Length; i++)
        {
            v[i] = cells[i] switch
            {
                null => mode.IsNull ? Value.Null : Value.NaN,
                int x => Value.Of((long)x),
                long x => Value.Of(x),
                double x => Value.Of(x),
                bool x => Value.Of(x),
                string x => Value.Of(x),
                _ => throw new ArgumentException("cell"),
            };
        }
        return ColumnFactory.FromValues(v, mode);
    }

    public static Value[] Values(Column c)
    {
        var v = new Value[c.Length];
        for (var i = 0; i < v.Length; i++) v[i] = c.GetValue(i);
        return v;
    }

    public static readonly Mode BoxedNanCow = new(StringStorage.Boxed, MissingMarker.Nan, WriteSemantics.Cow);
    public static readonly Mode ArrowNan = new(StringStorage.Arrow, MissingMarker.Nan, WriteSemantics.Cow);
    public static readonly Mode BoxedNull = new(StringStorage.Boxed, MissingMarker.Null, WriteSemantics.Cow);
}
