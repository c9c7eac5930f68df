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
/// <para>
/// While a column may still be a number its text is not kept (the parsed numbers are): on a wide numeric file
/// the text and offsets of every cell were most of the loader's peak memory. A column that stops being a
/// number after some of its values went by without text reports <see cref="NeedsText"/>, and the reader
/// fills it again in a second pass with a text-only builder.
/// </para>
/// </summary>
internal sealed class CsvColumnBuilder
{
    internal const NumberStyles IntegerStyle = NumberStyles.AllowLeadingSign;
    internal const NumberStyles FloatStyle = NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent;

    private byte[] _data = [];
    private int[] _offsets = [];
    private bool _storingText;
    private byte[] _valid = new byte[8];
    private int _count;
    private long _bytes;
    private int _nulls;
    private bool _canInt = true, _canFloat = true, _canBool = true, _canTime = true;

    // Values parsed while inference still allows their kind, so Finish does not parse the text again.
    private long[]? _ints = new long[65];
    private double[]? _floats;

    public CsvColumnBuilder(string name, bool textOnly = false)
    {
        Name = name;
        if (textOnly)
        {
            // Read again because the first pass ruled out int64 (as text or as a float beyond 2^53): it may
            // still be float64, so floats are parsed from the text kept this time.
            _canInt = false;
            _ints = null;
            _floats = new double[_slots];
            StartText();
        }
    }

    public string Name { get; }

    /// <summary>True when the column turned out not to be numeric after values whose text was not kept.</summary>
    public bool NeedsText { get; private set; }

    private void StartText()
    {
        // Every earlier cell is missing (or there is none): their slots are empty strings at offset 0.
        _storingText = true;
        _data = new byte[256];
        _offsets = new int[Math.Max(_slots, 65)];
    }

    /// <summary>Appends a field's value; false when the column's text passed 2 GiB (int32 Arrow offsets).</summary>
    public bool Append(ReadOnlySpan<char> value)
    {
        Infer(value);
        if (!_storingText)
        {
            if (_canInt || _canFloat || NeedsText)
            {
                EnsureSlot();
                _valid[_count >> 3] |= (byte)(1 << (_count & 7));
                _count++;
                return true;
            }
            if (_nulls < _count)
            {
                // Values went by without their text: the reader reads this column again.
                NeedsText = true;
                _ints = null;
                _floats = null;
                EnsureSlot();
                _count++;
                return true;
            }
            StartText();
        }
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
        if (_storingText) _offsets[_count] = (int)_bytes;
    }

    // A value that parses as a number can be neither a bool nor a timestamp (and an int is also a float),
    // so each value rules out the kinds it cannot be and the column keeps the first kind all values fit.
    private void Infer(ReadOnlySpan<char> v)
    {
        if (NeedsText) return;
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
            if (_canFloat) FloatsFromInts();
            _ints = null;
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

    // The column stopped being int64: the integers so far become doubles. A long-to-double cast is exact up
    // to 2^53; a larger integer needs its text, so the column is read again.
    private void FloatsFromInts()
    {
        _floats = new double[Math.Max(_slots, 65)];
        var ints = _ints ?? [];
        for (var i = 0; i < _count; i++)
        {
            if (!IsValidSoFar(i)) { _floats[i] = double.NaN; continue; }
            var l = i < ints.Length ? ints[i] : 0;
            if (l > (1L << 53) || l < -(1L << 53))
            {
                NeedsText = true;
                _canFloat = false;
                _floats = null;
                return;
            }
            _floats[i] = l;
        }
    }

    private bool IsValidSoFar(int i) => (_valid[i >> 3] & (1 << (i & 7))) != 0;

    // Slots allocated for per-row arrays (offsets when text is kept, parsed numbers while numeric).
    private int _slots = 65;

    private void EnsureSlot()
    {
        if (_count + 2 > _slots)
        {
            _slots *= 2;
            if (_storingText) System.Array.Resize(ref _offsets, _slots);
            if (_ints is not null) System.Array.Resize(ref _ints, _slots);
            if (_floats is not null) System.Array.Resize(ref _floats, _slots);
        }
        if (_storingText && _offsets.Length < _slots) System.Array.Resize(ref _offsets, _slots);
        if ((_count >> 3) >= _valid.Length) System.Array.Resize(ref _valid, _valid.Length * 2);
    }

    public SourceColumn Finish()
    {
        if (NeedsText) throw new InvalidOperationException("column '" + Name + "' needs a second pass for its text");
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
        if (!_storingText) StartText(); // no rows: an empty string column
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
