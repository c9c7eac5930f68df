using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// One loaded column in a mode-neutral form: typed buffers plus validity, as read from the file. Each mode
/// gets its own <see cref="Column"/> from it (spec §2.1); buffers are shared between modes where the
/// representation agrees, which is safe because columns are immutable.
/// </summary>
internal abstract class SourceColumn
{
    protected SourceColumn(string name, int length)
    {
        Name = name;
        Length = length;
    }

    public string Name { get; }

    public int Length { get; }

    public abstract Column ToColumn(Mode mode);

    /// <summary>The same column holding only <paramref name="rows"/>, in that order (rows a reduced fixture keeps).</summary>
    public abstract SourceColumn Take(int[] rows);

    /// <summary>The validity of <paramref name="rows"/> of <paramref name="validity"/>, in that order.</summary>
    protected static Validity TakeValidity(Validity validity, int[] rows)
    {
        if (validity.NullCount == 0) return Validity.AllValid(rows.Length);
        var flags = new bool[rows.Length];
        for (var i = 0; i < rows.Length; i++) flags[i] = validity.IsValid(rows[i]);
        return Validity.FromFlags(flags);
    }

    /// <summary>The values at <paramref name="rows"/>, in that order.</summary>
    protected static T[] TakeValues<T>(ReadOnlySpan<T> values, int[] rows)
    {
        var result = new T[rows.Length];
        for (var i = 0; i < rows.Length; i++) result[i] = values[rows[i]];
        return result;
    }
}
