using System.Globalization;
using System.Text;
using Apache.Arrow;
using Parity.Engine.Columns;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// Collects one CSV column as UTF-8 bytes plus offsets and validity (the Arrow string layout) while tracking
/// which types every non-missing field still fits, in the order of spec §6: int64, float64, bool, ISO 8601
/// timestamp, else string. <see cref="Finish"/> parses the bytes into the winning type; a string column keeps
/// the bytes as they are, so arrow storage never goes through managed strings.
/// </summary>
internal sealed class CsvColumnBuilder
{
    internal const NumberStyles IntegerStyle = NumberStyles.AllowLeadingSign;
    internal const NumberStyles FloatStyle = NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent;

    private byte[] _data = new byte[256];
    private int[] _offsets = new int[65];
    private byte[] _valid = new byte[8];
    private int _count;
    private long _bytes;
    private int _nulls;
    private bool _canInt = true, _canFloat = true, _canBool = true, _canTime = true;

    public CsvColumnBuilder(string name)
    {
        Name = name;
    }

    public string Name { get; }

    /// <summary>Appends a field's value; false when the column's text passed 2 GiB (int32 Arrow offsets).</summary>
    public bool Append(ReadOnlySpan<char> value)
    {
        Infer(value);
        var max = Encoding.UTF8.GetMaxByteCount(value.Length);
        if (_bytes + max > _data.Length)
        {
            var need = _bytes + max;
            if (need > System.Array.MaxLength) return false;
            System.Array.Resize(ref _data, (int)Math.Min(System.Array.MaxLength, Math.Max(need, _data.Length * 2L)));
        }
        _bytes += Encoding.UTF8.GetBytes(value, _data.AsSpan((int)_bytes));
        if (_bytes > int.MaxValue) return false;
        EnsureSlot();
        _valid[_count >> 3] |= (byte)(1 << (_count & 7));
        _count++;
        _offsets[_count] = (int)_bytes;
        return true;
    }

    public void AppendMissing()
    {
        EnsureSlot();
        _nulls++;
        _count++;
        _offsets[_count] = (int)_bytes;
    }

    private void Infer(ReadOnlySpan<char> v)
    {
        if (_canInt && !long.TryParse(v, IntegerStyle, CultureInfo.InvariantCulture, out _)) _canInt = false;
        if (_canInt) return;
        if (_canFloat && !double.TryParse(v, FloatStyle, CultureInfo.InvariantCulture, out _)) _canFloat = false;
        if (_canFloat) return;
        if (_canBool && !(v.Equals("true", StringComparison.OrdinalIgnoreCase) || v.Equals("false", StringComparison.OrdinalIgnoreCase))) _canBool = false;
        if (_canBool) return;
        if (_canTime && !Iso8601.TryParse(v, out _)) _canTime = false;
    }

    private void EnsureSlot()
    {
        if (_count + 2 > _offsets.Length) System.Array.Resize(ref _offsets, _offsets.Length * 2);
        if ((_count >> 3) >= _valid.Length) System.Array.Resize(ref _valid, _valid.Length * 2);
    }

    public SourceColumn Finish()
    {
        var n = _count;
        var validity = _nulls == 0 ? Validity.AllValid(n) : new Validity(_valid, 0, n);
        var hasValue = _nulls < n;
        if (n > 0 && !hasValue)
        {
            // Nothing but missing: float64, as legacy stacks read an empty column (documented in docs/data.md).
            var nan = new double[n];
            nan.AsSpan().Fill(double.NaN);
            return new SourceFloat64(Name, nan, validity);
        }
        if (n > 0 && _canInt) return new SourceInt64(Name, ParseInts(validity), validity);
        if (n > 0 && _canFloat) return new SourceFloat64(Name, ParseFloats(validity), validity);
        if (n > 0 && _canBool) return new SourceBool(Name, ParseBools(validity), validity);
        if (n > 0 && _canTime) return new SourceTimestamp(Name, ParseTimes(validity), validity);
        var offsetBytes = new byte[(n + 1) * 4];
        System.Runtime.InteropServices.MemoryMarshal.AsBytes(_offsets.AsSpan(0, n + 1)).CopyTo(offsetBytes);
        var bitmap = _nulls == 0 ? ArrowBuffer.Empty : new ArrowBuffer(_valid.AsMemory(0, (n + 7) >> 3));
        var array = new StringArray(n, new ArrowBuffer(offsetBytes), new ArrowBuffer(_data.AsMemory(0, (int)_bytes)), bitmap, _nulls);
        return new SourceStrings(Name, array, nullIsNone: false);
    }

    private ReadOnlySpan<byte> Cell(int i) => _data.AsSpan(_offsets[i], _offsets[i + 1] - _offsets[i]);

    private long[] ParseInts(Validity validity)
    {
        var result = new long[_count];
        for (var i = 0; i < result.Length; i++)
            if (validity.IsValid(i)) result[i] = long.Parse(Cell(i), IntegerStyle, CultureInfo.InvariantCulture);
        return result;
    }

    private double[] ParseFloats(Validity validity)
    {
        var result = new double[_count];
        for (var i = 0; i < result.Length; i++)
            result[i] = validity.IsValid(i) ? double.Parse(Cell(i), FloatStyle, CultureInfo.InvariantCulture) : double.NaN;
        return result;
    }

    private bool[] ParseBools(Validity validity)
    {
        var result = new bool[_count];
        for (var i = 0; i < result.Length; i++)
            if (validity.IsValid(i)) result[i] = Cell(i).Length == 4; // "true" (any case); inference admitted only true/false
        return result;
    }

    private long[] ParseTimes(Validity validity)
    {
        var result = new long[_count];
        for (var i = 0; i < result.Length; i++)
            if (validity.IsValid(i)) Iso8601.TryParse(Cell(i), out result[i]);
        return result;
    }
}
