namespace Parity.Engine.IO.Internal.ParquetPages;

/// <summary>
/// The few parts of the Thrift compact protocol that Parquet page headers and footers use (Parquet format,
/// "parquet.thrift"; Thrift compact protocol spec): zigzag varints, field headers with id deltas, and skipping
/// of fields we do not read. Every read is bounds-checked and nesting is capped, so a corrupt header ends in
/// <see cref="InvalidDataException"/>, never a wild read or a stack overflow.
/// </summary>
internal ref struct ThriftCompactReader
{
    public const byte Stop = 0;
    public const byte BoolTrue = 1;
    public const byte BoolFalse = 2;
    public const byte Byte = 3;
    public const byte I16 = 4;
    public const byte I32 = 5;
    public const byte I64 = 6;
    public const byte Double = 7;
    public const byte Binary = 8;
    public const byte List = 9;
    public const byte Set = 10;
    public const byte Map = 11;
    public const byte Struct = 12;

    private const int MaxDepth = 32;

    private readonly ReadOnlySpan<byte> _bytes;

    public ThriftCompactReader(ReadOnlySpan<byte> bytes)
    {
        _bytes = bytes;
        Position = 0;
    }

    public int Position { get; private set; }

    /// <summary>The next field of a struct: its id and type; type <see cref="Stop"/> ends the struct.</summary>
    public (short Id, byte Type) ReadFieldHeader(short previousId)
    {
        var b = ReadByte();
        var type = (byte)(b & 0x0F);
        // STOP is the single byte 0; a field header with type 0 and an id delta is not Thrift (and makes
        // Parquet.Net 6.1.0 loop forever when it is the footer's last byte).
        if (type == Stop) return b == 0 ? ((short)0, Stop) : throw Corrupt("a field header of type 0");
        var delta = b >> 4;
        var id = delta != 0 ? (short)(previousId + delta) : (short)ZigZag(ReadVarint());
        return (id, type);
    }

    public int ReadI32()
    {
        var v = ZigZag(ReadVarint());
        if (v is < int.MinValue or > int.MaxValue) throw Corrupt("an i32 out of range");
        return (int)v;
    }

    /// <summary>Skips one value of the given type, nested values included.</summary>
    public void Skip(byte type, int depth = 0)
    {
        if (depth > MaxDepth) throw Corrupt("nested too deeply");
        switch (type)
        {
            case BoolTrue or BoolFalse:
                return; // a struct field's boolean lives in its type nibble
            case Byte:
                Advance(1);
                return;
            case I16 or I32 or I64:
                ReadVarint();
                return;
            case Double:
                Advance(8);
                return;
            case Binary:
                Advance(Length(ReadVarint()));
                return;
            case List or Set:
            {
                var (size, element) = ReadListHeader();
                for (var i = 0; i < size; i++)
                {
                    if (element is BoolTrue or BoolFalse) Advance(1); // list booleans take a byte each
                    else Skip(element, depth + 1);
                }
                return;
            }
            case Map:
            {
                var size = Length(ReadVarint());
                if (size == 0) return;
                var kinds = ReadByte();
                for (var i = 0; i < size; i++)
                {
                    Skip((byte)(kinds >> 4), depth + 1);
                    Skip((byte)(kinds & 0x0F), depth + 1);
                }
                return;
            }
            case Struct:
                SkipStruct(string.Empty, NoShape, depth);
                return;
            default:
                throw Corrupt("unknown field type " + type);
        }
    }

    /// <summary>
    /// Skips one struct while checking the types of the fields <paramref name="shape"/> knows (by struct name and
    /// field id): a field of another type than the format defines is corrupt. Nested structs and lists of
    /// structs are checked with their own names; unknown fields are skipped.
    /// </summary>
    public void SkipStruct(string name, IReadOnlyDictionary<(string Struct, short Field), (byte Type, string? Nested)> shape, int depth = 0)
    {
        if (depth > MaxDepth) throw Corrupt("nested too deeply");
        short id = 0;
        while (true)
        {
            var (next, type) = ReadFieldHeader(id);
            if (type == Stop) return;
            id = next;
            if (!shape.TryGetValue((name, id), out var expected))
            {
                Skip(type, depth + 1);
                continue;
            }
            if (type != expected.Type) throw Corrupt($"{name} field {id} has type {type}, not {expected.Type}");
            if (type == Struct && expected.Nested is { } nested)
            {
                SkipStruct(nested, shape, depth + 1);
            }
            else if (type == List && expected.Nested is { } element)
            {
                var (size, elementType) = ReadListHeader();
                if (elementType != Struct) throw Corrupt($"{name} field {id} is a list of type {elementType}, not of structs");
                for (var i = 0; i < size; i++) SkipStruct(element, shape, depth + 1);
            }
            else
            {
                Skip(type, depth + 1);
            }
        }
    }

    private static readonly Dictionary<(string Struct, short Field), (byte Type, string? Nested)> NoShape = [];

    /// <summary>A list or set header: the size in the high nibble (15: a varint follows) and the element type.</summary>
    private (int Size, byte Element) ReadListHeader()
    {
        var head = ReadByte();
        var size = head >> 4 == 15 ? Length(ReadVarint()) : head >> 4;
        return (size, (byte)(head & 0x0F));
    }

    private int Length(long n)
    {
        if (n < 0 || n > _bytes.Length - Position) throw Corrupt("a length past the end");
        return (int)n;
    }

    private byte ReadByte()
    {
        if (Position >= _bytes.Length) throw Corrupt("truncated");
        return _bytes[Position++];
    }

    private void Advance(int n)
    {
        if (n > _bytes.Length - Position) throw Corrupt("truncated");
        Position += n;
    }

    private long ReadVarint()
    {
        ulong result = 0;
        for (var shift = 0; shift < 64; shift += 7)
        {
            var b = ReadByte();
            result |= (ulong)(b & 0x7F) << shift;
            if ((b & 0x80) == 0) return (long)result;
        }
        throw Corrupt("a varint longer than 10 bytes");
    }

    private static long ZigZag(long n) => (long)((ulong)n >> 1) ^ -(n & 1);

    private static InvalidDataException Corrupt(string what) => new("corrupt Thrift data: " + what);
}
