using Parity.Engine.Columns;
using Parity.Engine.Modes;

namespace Parity.Benchmarks.Data;

/// <summary>Seeded benchmark data: the same values in both string storages, generated without Values.</summary>
public static class BenchData
{
    private const string Alphabet = "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789 -";

    /// <summary>
    /// <paramref name="count"/> ASCII strings of <paramref name="minBytes"/>..<paramref name="maxBytes"/> bytes with
    /// <paramref name="missingRate"/> missing, as managed strings (null = missing).
    /// </summary>
    public static string?[] Strings(int count, int minBytes, int maxBytes, double missingRate, int seed)
    {
        var rng = new Random(seed);
        var result = new string?[count];
        Span<char> buf = stackalloc char[maxBytes];
        for (var i = 0; i < count; i++)
        {
            if (rng.NextDouble() < missingRate) continue;
            var len = rng.Next(minBytes, maxBytes + 1);
            for (var j = 0; j < len; j++) buf[j] = Alphabet[rng.Next(Alphabet.Length)];
            result[i] = new string(buf[..len]);
        }
        return result;
    }

    /// <summary>The boxed storage: one managed string per cell (NaN for missing, as legacy loads do).</summary>
    public static ObjectColumn Boxed(string?[] strings, MissingMarker marker)
    {
        var cells = new object?[strings.Length];
        for (var i = 0; i < cells.Length; i++)
            cells[i] = strings[i] is { } s ? s : marker == MissingMarker.Nan ? double.NaN : null;
        return new ObjectColumn(cells, marker);
    }

    /// <summary>The Arrow storage: one UTF-8 array.</summary>
    public static Utf8Column Arrow(string?[] strings, MissingMarker marker)
    {
        var b = new Utf8ColumnBuilder(strings.Length, strings.Length * 24);
        foreach (var s in strings)
        {
            if (s is null) b.AppendMissing();
            else b.Append(s);
        }
        return b.Build(marker);
    }
}
