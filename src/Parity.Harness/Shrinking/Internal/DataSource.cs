using Parity.Engine.IO;

namespace Parity.Harness.Shrinking.Internal;

/// <summary>One data file the script loads, read once, with the rows and columns the reduction keeps so far.</summary>
internal sealed class DataSource(string fullPath, string shown, LoadOptions options, ReducibleFile file)
{
    public string FullPath => fullPath;

    /// <summary>The path as the (first) load statement wrote it.</summary>
    public string Shown => shown;

    public LoadOptions Options => options;

    public ReducibleFile File => file;

    public int[] Rows { get; set; } = Enumerable.Range(0, file.RowCount).ToArray();

    public bool[] Keep { get; set; } = Enumerable.Repeat(true, file.ColumnNames.Count).ToArray();

    public int KeptColumns
    {
        get
        {
            var n = 0;
            foreach (var k in Keep) if (k) n++;
            return n;
        }
    }
}
