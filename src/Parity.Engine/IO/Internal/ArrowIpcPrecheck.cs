using System.Buffers.Binary;

namespace Parity.Engine.IO.Internal;

/// <summary>
/// Walks the encapsulated messages of an Arrow IPC stream before Apache.Arrow reads it and rejects vector
/// lengths that do not fit their message. Apache.Arrow 23 sizes lists from these counts before it reads
/// them (a record batch's node count becomes a list capacity), so a few corrupted bytes in a 2 KB file
/// made it allocate gigabytes. Layout: Apache Arrow columnar format, "Encapsulated message format"
/// (optional 0xFFFFFFFF continuation, int32 metadata size, a Message flatbuffer, then bodyLength bytes)
/// and the flatbuffer binary format (root uoffset, tables with a vtable of uint16 field offsets, vectors
/// as an int32 count followed by elements).
/// </summary>
internal static class ArrowIpcPrecheck
{
    private const int MaxDepth = 64;

    /// <summary>
    /// Null when the messages are sound, else what is wrong and at which byte. For the file format pass the
    /// bytes after the magic; the footer (located from the trailing size and magic) is not a message.
    /// </summary>
    public static string? Check(ReadOnlySpan<byte> stream, bool fileFormat)
    {
        if (fileFormat && stream.Length >= 10 && stream[^6..].SequenceEqual("ARROW1"u8))
        {
            var footer = BinaryPrimitives.ReadInt32LittleEndian(stream[^10..]);
            var end = (long)stream.Length - 10 - footer;
            if (footer < 0 || end < 0) return "the footer size does not fit the file";
            stream = stream[..(int)end];
        }
        var at = 0L;
        while (at + 4 <= stream.Length)
        {
            var size = BinaryPrimitives.ReadInt32LittleEndian(stream[(int)at..]);
            at += 4;
            if (size == -1)
            {
                if (at + 4 > stream.Length) return null;
                size = BinaryPrimitives.ReadInt32LittleEndian(stream[(int)at..]);
                at += 4;
            }
            if (size == 0) return null; // end of stream (a file's footer follows)
            if (size < 0 || at + size > stream.Length) return $"message at byte {at - 4} declares {size} metadata bytes; the file has {stream.Length - at}";
            var meta = stream.Slice((int)at, size);
            var problem = Message(meta, out var bodyLength);
            if (problem is not null) return problem + $" (message at byte {at - 4})";
            at += size;
            if (bodyLength < 0 || bodyLength > stream.Length - at) return $"message at byte {at - size - 4} declares a body of {bodyLength} bytes; the file has {stream.Length - at}";
            at += bodyLength;
        }
        return null;
    }

    private static string? Message(ReadOnlySpan<byte> m, out long bodyLength)
    {
        bodyLength = 0;
        if (!Table(m, RootOffset(m), out var message)) return "a message header points outside its metadata";
        var headerType = Field(m, message, 1, out var p) ? m[p] : (byte)0;
        if (Field(m, message, 3, out p))
        {
            if (p + 8 > m.Length) return "a message body length lies outside its metadata";
            bodyLength = BinaryPrimitives.ReadInt64LittleEndian(m[p..]);
        }
        if (!Field(m, message, 2, out p)) return null;
        if (!Ref(m, p, out var header)) return "a message header points outside its metadata";
        return headerType switch
        {
            1 => Schema(m, header),
            2 => Field(m, header, 1, out p) ? (Ref(m, p, out var data) ? RecordBatch(m, data) : "a dictionary batch points outside its metadata") : null,
            3 => RecordBatch(m, header),
            _ => null,
        };
    }

    private static string? Schema(ReadOnlySpan<byte> m, int schema) => Fields(m, schema, 1, 0);

    /// <summary>Checks the vector of field tables in slot <paramref name="slot"/> of a table, and their children.</summary>
    private static string? Fields(ReadOnlySpan<byte> m, int table, int slot, int depth)
    {
        if (depth > MaxDepth) return "fields nested too deep";
        if (!Table(m, table, out _)) return "a table points outside its metadata";
        if (!Field(m, table, slot, out var p)) return null;
        if (!Vector(m, p, 4, out var start, out var count)) return "a field list is longer than its metadata";
        for (var i = 0; i < count; i++)
        {
            if (!Ref(m, start + 4 * i, out var field)) return "a field points outside its metadata";
            var inner = Fields(m, field, 5, depth + 1);
            if (inner is not null) return inner;
        }
        return null;
    }

    private static string? RecordBatch(ReadOnlySpan<byte> m, int batch)
    {
        if (!Table(m, batch, out _)) return "a record batch points outside its metadata";
        // nodes: FieldNode structs of 16 bytes; buffers: Buffer structs of 16 bytes; variadic counts: int64.
        if (Field(m, batch, 1, out var p) && !Vector(m, p, 16, out _, out _)) return "a record batch's node list is longer than its metadata";
        if (Field(m, batch, 2, out p) && !Vector(m, p, 16, out _, out _)) return "a record batch's buffer list is longer than its metadata";
        if (Field(m, batch, 4, out p) && !Vector(m, p, 8, out _, out _)) return "a record batch's variadic count list is longer than its metadata";
        return null;
    }

    private static int RootOffset(ReadOnlySpan<byte> m) => m.Length < 4 ? -1 : (int)Math.Min(BinaryPrimitives.ReadUInt32LittleEndian(m), int.MaxValue);

    /// <summary>True when a table starts at <paramref name="pos"/> with its vtable inside <paramref name="m"/>.</summary>
    private static bool Table(ReadOnlySpan<byte> m, int pos, out int table)
    {
        table = pos;
        if (pos < 0 || pos + 4 > m.Length) return false;
        var vtable = (long)pos - BinaryPrimitives.ReadInt32LittleEndian(m[pos..]);
        if (vtable < 0 || vtable + 4 > m.Length) return false;
        var vsize = BinaryPrimitives.ReadUInt16LittleEndian(m[(int)vtable..]);
        return vsize >= 4 && vtable + vsize <= m.Length;
    }

    /// <summary>The absolute position of field <paramref name="slot"/> of a checked table, when present and inside.</summary>
    private static bool Field(ReadOnlySpan<byte> m, int table, int slot, out int pos)
    {
        pos = 0;
        var vtable = table - BinaryPrimitives.ReadInt32LittleEndian(m[table..]);
        var vsize = BinaryPrimitives.ReadUInt16LittleEndian(m[vtable..]);
        var entry = 4 + 2 * slot;
        if (entry + 2 > vsize) return false;
        var offset = BinaryPrimitives.ReadUInt16LittleEndian(m[(vtable + entry)..]);
        if (offset == 0) return false;
        pos = table + offset;
        return pos < m.Length;
    }

    private static bool Ref(ReadOnlySpan<byte> m, int pos, out int target)
    {
        target = -1;
        if (pos < 0 || pos + 4 > m.Length) return false;
        var t = pos + (long)BinaryPrimitives.ReadUInt32LittleEndian(m[pos..]);
        if (t >= m.Length) return false;
        target = (int)t;
        return true;
    }

    private static bool Vector(ReadOnlySpan<byte> m, int pos, int width, out int start, out int count)
    {
        start = 0;
        count = 0;
        if (!Ref(m, pos, out var v) || v + 4 > m.Length) return false;
        var n = BinaryPrimitives.ReadInt32LittleEndian(m[v..]);
        if (n < 0 || v + 4 + (long)n * width > m.Length) return false;
        start = v + 4;
        count = n;
        return true;
    }
}
