using FsCheck.Xunit;
using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Operations.Internal;

namespace Parity.Tests.Engine.Operations;

/// <summary>
/// The string id map behind sorting, grouping and joining on strings: ids in order of first insertion, equal bytes
/// one id, absent keys -1 on lookup, whatever the look-ahead and growth do. The reference is a .NET Dictionary
/// over the same strings (ordinal equality, which for UTF-8 bytes is byte equality).
/// </summary>
public sealed class Utf8IdMapTests
{
    private static readonly string[] Words = ["Ola", "ola", "Σοφία", "🚢", "", "harbor line north pier", "\0"];

    [Property(MaxTest = 60)]
    public bool Codes_are_first_insertion_ids(int seed)
    {
        var rng = new Random(seed);
        var rows = rng.Next(0, 3_000);
        var inserted = Column(rng, rows, out var insertedCells);
        var probed = Column(rng, rng.Next(0, 200), out var probedCells);
        var map = new Utf8IdMap();
        var codes = new int[rows];
        map.Code(inserted, codes, insert: true, missingCode: -2);
        var found = new int[probedCells.Length];
        map.Code(probed, found, insert: false, missingCode: -2);
        var ids = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < rows; i++)
        {
            var cell = insertedCells[i];
            var expected = cell is null ? -2 : ids.TryGetValue(cell, out var id) ? id : ids[cell] = ids.Count;
            if (codes[i] != expected) return false;
        }
        for (var i = 0; i < probedCells.Length; i++)
        {
            var cell = probedCells[i];
            var expected = cell is null ? -2 : ids.TryGetValue(cell, out var id) ? id : -1;
            if (found[i] != expected) return false;
        }
        return map.Count == ids.Count;
    }

    private static Utf8Column Column(Random rng, int rows, out string?[] cells)
    {
        cells = new string?[rows];
        var b = new Utf8ColumnBuilder(rows, rows * 8);
        for (var i = 0; i < rows; i++)
        {
            // Many distinct values (the map grows several times) and many repeats; about one in eight missing.
            cells[i] = rng.Next(8) == 0 ? null : Words[rng.Next(Words.Length)] + rng.Next(rng.Next(1, 2_000));
            if (cells[i] is { } s) b.Append(s);
            else b.AppendMissing();
        }
        return b.Build(MissingMarker.Null);
    }
}
