using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Script.Diagnostics;
using Parity.Script.Running;

namespace Parity.Tests.Harness;

/// <summary>Builds tables and runs by hand (Harbor Line ferry data), so the differ and golden store are tested without the interpreter.</summary>
internal static class HarnessFixtures
{
    public static Table Table(Mode mode, params (string Name, Value[] Values)[] columns)
    {
        var names = new string[columns.Length];
        var cols = new Column[columns.Length];
        var rows = columns.Length == 0 ? 0 : columns[0].Values.Length;
        for (var i = 0; i < columns.Length; i++)
        {
            names[i] = columns[i].Name;
            cols[i] = ColumnFactory.FromValues(columns[i].Values, mode);
        }
        return new Table(names, cols, rows);
    }

    /// <summary>A missing cell as <paramref name="mode"/> writes one (the column factory picks NaN/NaT/None/null).</summary>
    public static Value Missing(Mode mode) => mode.IsNull ? Value.Null : Value.NaN;

    public static Value I(long v) => Value.Of(v);

    public static Value F(double v) => Value.Of(v);

    public static Value S(string v) => Value.Of(v);

    /// <summary>The tickets frame: passenger, age (two missing), fare (a refund), note (one missing).</summary>
    public static Table Tickets(Mode mode)
    {
        var m = Missing(mode);
        return Table(mode,
            ("passenger", [S("Åsa Lindqvist"), S("Νίκος Παππάς"), S("李小龍"), S("Zoë 🚢")]),
            ("age", [I(34), m, I(71), m]),
            ("fare", [F(12.5), F(8.0), F(-8.0), F(4.25)]),
            ("note", [S("window"), m, S("refund"), S("late")]));
    }

    public static ModeRun Run(Mode mode, params (string Label, Table Table)[] checkpoints)
    {
        var run = new ModeRun(mode, "ferry/refunds.parity");
        var line = 10;
        foreach (var (label, table) in checkpoints)
            run.Checkpoints.Add(new CheckpointResult(label, label, line++, 1, table));
        return run;
    }

    public static Diagnostic Error(string code, string message, int line) =>
        new(code, message, "ferry/refunds.parity", new SourceSpan(0, 1, line - 1, 0));
}
