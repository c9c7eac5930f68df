using Parity.Engine.Columns;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Harness.Showing;

namespace Parity.Tests.Reports;

public sealed class TableTextTests
{
    private static string[] Lines(Parity.Engine.Frames.Table table)
    {
        using var w = new StringWriter { NewLine = "\n" };
        TableText.Write(table, w);
        return w.ToString().TrimEnd('\n').Split('\n');
    }

    [Fact]
    public void Header_has_names_and_type_labels_then_rows_and_a_count()
    {
        var lines = Lines(ShowTables.Build(Mode.Modern,
            ("passenger", ColumnType.Utf8, [Value.Of("Ann"), Value.Null]),
            ("age", ColumnType.Int64, [Value.Of(7L), Value.Of(31L)])));
        Assert.Equal(
            [
                "passenger  age",
                "utf8       int64",
                "---------  -----",
                "'Ann'          7",
                "null          31",
                "(2 rows)",
            ],
            lines);
    }

    // Unicode Standard Annex #11: wide characters take two columns, so padding counts them twice.
    [Fact]
    public void Aligns_by_display_width()
    {
        var names = new[] { "Zo\u00EB", "\u674E\u5C0F\u9F8D", "\U0001F6A2 Ferry", "\u0395\u03BB\u03AD\u03BD\u03B7", "Zoe\u0308" };
        var lines = Lines(ShowTables.Build(Mode.Modern,
            ("passenger", ColumnType.Utf8, names.Select(Value.Of).ToArray()),
            ("fare", ColumnType.Float64, [Value.Of(12.5), Value.Of(-3.0), Value.Of(100.25), Value.Null, Value.Of(double.NaN)])));
        var rows = lines[3..^1];
        Assert.Equal(5, rows.Length);
        var width = DisplayWidth.Of(rows[0]);
        Assert.All(rows, r => Assert.Equal(width, DisplayWidth.Of(r))); // right-aligned last column ends together
        var firstColumn = names.Max(n => DisplayWidth.Of("'" + n + "'"));
        Assert.Equal(firstColumn + 2, lines[0].IndexOf("fare", StringComparison.Ordinal));
        Assert.Contains("float:NaN", rows[4], StringComparison.Ordinal);
    }

    // ECMA-48: control characters would drive the terminal; they are shown as visible escapes.
    [Fact]
    public void Control_characters_in_names_and_values_are_escaped()
    {
        var lines = Lines(ShowTables.Build(Mode.Legacy,
            ("note\u001b[2J", ColumnType.Object, [Value.Of("red\u001b[31m\nline\u2028"), Value.NoneRef])));
        foreach (var line in lines)
            foreach (var c in line)
                Assert.False(c < ' ' || c == '\u2028', "control character in: " + line);
        Assert.Equal("note\\u{1B}[2J", lines[0]);
        Assert.Equal("object", lines[1]);
        Assert.Equal("'red\\u{1B}[31m\\nline\\u{2028}'", lines[3]);
        Assert.Equal("None", lines[4]);
    }
}
