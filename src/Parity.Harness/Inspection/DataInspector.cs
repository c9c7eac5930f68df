using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Memory;
using Parity.Engine.Modes;

namespace Parity.Harness.Inspection;

/// <summary>
/// Builds a <see cref="DataInspection"/>: loads the file once per string-storage and missing-marker pair
/// (the loader parses once and converts per mode; the writes axis never changes a type), takes type labels
/// from each mode, missing counts from <c>modern</c> (the null marker: a NaN read from a file is a value
/// there, not a missing cell), and bytes from <see cref="ColumnMemory"/> under <c>legacy</c> (boxed) and
/// <c>modern</c> (Arrow).
/// </summary>
public static class DataInspector
{
    public static DataInspection Inspect(string path, LoadOptions options)
    {
        var tables = new Dictionary<(StringStorage, MissingMarker), Table>();
        Table TableFor(Mode m)
        {
            var key = (m.Strings, m.Missing);
            if (!tables.TryGetValue(key, out var t))
            {
                t = DataLoader.Load(path, options, m);
                tables[key] = t;
            }
            return t;
        }
        var legacy = TableFor(Mode.Legacy);
        var modern = TableFor(Mode.Modern);
        var columns = new List<ColumnInspection>(legacy.ColumnCount);
        for (var c = 0; c < legacy.ColumnCount; c++)
        {
            var types = new List<KeyValuePair<string, string>>(2 + Mode.All.Count)
            {
                new("legacy", legacy.Columns[c].TypeLabel),
                new("modern", modern.Columns[c].TypeLabel),
            };
            foreach (var m in Mode.All)
                types.Add(new(m.Spelling, TableFor(m).Columns[c].TypeLabel));
            columns.Add(new ColumnInspection(
                legacy.Names[c],
                types,
                modern.Columns[c].MissingCount,
                ColumnMemory.Bytes(legacy.Columns[c]),
                ColumnMemory.Bytes(modern.Columns[c])));
        }
        return new DataInspection(options.DisplayPath ?? path, legacy.RowCount, columns);
    }
}
