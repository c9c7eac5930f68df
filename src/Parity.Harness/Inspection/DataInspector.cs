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
/// <c>modern</c> (Arrow). One converted table is alive at a time, so a large file costs the memory of one load
/// (plus the parse the loader keeps), not of four.
/// </summary>
public static class DataInspector
{
    /// <summary>
    /// Inspects the file at <paramref name="path"/> as a script would load it; <paramref name="displayPath"/>
    /// names it in messages, and a CSV file takes <paramref name="delimiter"/> and <paramref name="missingTokens"/>
    /// as <c>load ... with (delimiter = ..., missing = [...])</c> does.
    /// </summary>
    public static DataInspection Inspect(string path, string displayPath, char? delimiter, IReadOnlyList<string>? missingTokens)
    {
        var options = LoadOptions.Default with { DisplayPath = displayPath };
        if (delimiter is { } d) options = options with { Delimiter = d };
        if (missingTokens is { Count: > 0 }) options = options with { MissingTokens = missingTokens };
        return Inspect(path, options);
    }

    public static DataInspection Inspect(string path, LoadOptions options)
    {
        var labels = new Dictionary<(StringStorage, MissingMarker), string[]>();
        string[] names = [];
        var rows = 0;
        long[] boxedBytes = [], arrowBytes = [];
        int[] missing = [];
        foreach (var mode in (Mode[])[Mode.Legacy, Mode.Modern, .. Mode.All])
        {
            var key = (mode.Strings, mode.Missing);
            if (labels.ContainsKey(key)) continue;
            var table = DataLoader.Load(path, options, mode);
            var types = new string[table.ColumnCount];
            for (var c = 0; c < types.Length; c++) types[c] = table.Columns[c].TypeLabel;
            labels[key] = types;
            if (mode == Mode.Legacy)
            {
                names = [.. table.Names];
                rows = table.RowCount;
                boxedBytes = BytesOf(table);
            }
            else if (mode == Mode.Modern)
            {
                arrowBytes = BytesOf(table);
                missing = new int[table.ColumnCount];
                for (var c = 0; c < missing.Length; c++) missing[c] = table.Columns[c].MissingCount;
            }
        }
        var columns = new List<ColumnInspection>(names.Length);
        for (var c = 0; c < names.Length; c++)
        {
            var types = new List<KeyValuePair<string, string>>(2 + Mode.All.Count)
            {
                new("legacy", labels[(Mode.Legacy.Strings, Mode.Legacy.Missing)][c]),
                new("modern", labels[(Mode.Modern.Strings, Mode.Modern.Missing)][c]),
            };
            foreach (var m in Mode.All)
                types.Add(new(m.Spelling, labels[(m.Strings, m.Missing)][c]));
            columns.Add(new ColumnInspection(names[c], types, missing[c], boxedBytes[c], arrowBytes[c]));
        }
        return new DataInspection(options.DisplayPath ?? path, rows, columns);
    }

    private static long[] BytesOf(Table table)
    {
        var bytes = new long[table.ColumnCount];
        for (var c = 0; c < bytes.Length; c++) bytes[c] = ColumnMemory.Bytes(table.Columns[c]);
        return bytes;
    }
}
