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

    // Values parsed while inference still allows their kind, so Finish does not parse the text again.
    private long[]? _ints = new long[65];
    private double[]? _floats;

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

    // A value that parses as a number can be neither a bool nor a timestamp (and an int is also a float),
    // so each value rules out the kinds it cannot be and the column keeps the first kind all values fit.
    private void Infer(ReadOnlySpan<char> v)
    {
        if (_canInt)
        {
            if (long.TryParse(v, IntegerStyle, CultureInfo.InvariantCulture, out var l))
            {
                EnsureSlot();
                _ints![_count] = l;
                _canBool = _canTime = false;
                return;
            }
            _canInt = false;
            _ints = null;
            if (_canFloat) FloatsFromText();
        }
        if (_canFloat)
        {
            if (double.TryParse(v, FloatStyle, CultureInfo.InvariantCulture, out var d))
            {
                EnsureSlot();
                _floats![_count] = d;
                _canBool = _canTime = false;
                return;
            }
            _canFloat = false;
            _floats = null;
        }
        if (_canBool && (v.Equals("true", StringComparison.OrdinalIgnoreCase) || v.Equals("false", StringComparison.OrdinalIgnoreCase)))
        {
            _canTime = false;
            return;
        }
        _canBool = false;
        if (_canTime && !Iso8601.TryParse(v, out _)) _canTime = false;
    }

    // The column stopped being int64: parse the cells so far from their text (exact, unlike a long-to-double cast above 2^53).
    private void FloatsFromText()
    {
        _floats = new double[_offsets.Length];
        for (var i = 0; i < _count; i++)
            _floats[i] = IsValidSoFar(i) ? double.Parse(Cell(i), FloatStyle, CultureInfo.InvariantCulture) : double.NaN;
    }

    private bool IsValidSoFar(int i) => (_valid[i >> 3] & (1 << (i & 7))) != 0;

    private void EnsureSlot()
    {
        if (_count + 2 > _offsets.Length)
        {
            System.Array.Resize(ref _offsets, _offsets.Length * 2);
            if (_ints is not null) System.Array.Resize(ref _ints, _offsets.Length);
            if (_floats is not null) System.Array.Resize(ref _floats, _offsets.Length);
        }
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
        if (n > 0 && _canInt) return new SourceInt64(Name, Trim(_ints!, n), validity);
        if (n > 0 && _canFloat)
        {
            var floats = Trim(_floats!, n);
            if (_nulls > 0)
                for (var i = 0; i < n; i++) if (!IsValidSoFar(i)) floats[i] = double.NaN;
            return new SourceFloat64(Name, floats, validity);
        }
        if (n > 0 && _canBool) return new SourceBool(Name, ParseBools(validity), validity);
        if (n > 0 && _canTime) return new SourceTimestamp(Name, ParseTimes(validity), validity);
        var offsetBytes = new byte[(n + 1) * 4];
        System.Runtime.InteropServices.MemoryMarshal.AsBytes(_offsets.AsSpan(0, n + 1)).CopyTo(offsetBytes);
        var bitmap = _nulls == 0 ? ArrowBuffer.Empty : new ArrowBuffer(_valid.AsMemory(0, (n + 7) >> 3));
        var array = new StringArray(n, new ArrowBuffer(offsetBytes), new ArrowBuffer(_data.AsMemory(0, (int)_bytes)), bitmap, _nulls);
        return new SourceStrings(Name, array, nullIsNone: false);
    }

    private ReadOnlySpan<byte> Cell(int i) => _data.AsSpan(_offsets[i], _offsets[i + 1] - _offsets[i]);

    private static T[] Trim<T>(T[] values, int n)
    {
        if (values.Length != n) System.Array.Resize(ref values, n);
        return values;
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
