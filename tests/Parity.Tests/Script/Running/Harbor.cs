using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Script.Parsing;
using Parity.Script.Running;

namespace Parity.Tests.Script.Running;

/// <summary>Harbor Line test data (invented) and a runner that parses and runs a script on it in one mode.</summary>
internal static class Harbor
{
    public static readonly Mode BoxedNanCow = new(StringStorage.Boxed, MissingMarker.Nan, WriteSemantics.Cow);
    public static readonly Mode ArrowNanAlias = new(StringStorage.Arrow, MissingMarker.Nan, WriteSemantics.Alias);
    public static readonly Mode ArrowNanCow = new(StringStorage.Arrow, MissingMarker.Nan, WriteSemantics.Cow);
    public static readonly Mode BoxedNullAlias = new(StringStorage.Boxed, MissingMarker.Null, WriteSemantics.Alias);

    /// <summary>tickets: ticket_id, sailing_id, passenger, age (one missing), fare (a refund), note (two missing), is_child.</summary>
    public static Table Tickets(Mode mode)
    {
        var m = Value.Null;
        return Build(mode, 5,
            ("ticket_id", [Value.Of(1L), Value.Of(2L), Value.Of(3L), Value.Of(4L), Value.Of(5L)]),
            ("sailing_id", [Value.Of(10L), Value.Of(10L), Value.Of(11L), Value.Of(11L), Value.Of(12L)]),
            ("passenger", [Value.Of("Zoë Brandt"), Value.Of("Σοφία Παππά"), Value.Of("山田 花子"), Value.Of("Ola 🚢"), Value.Of("Jörg Weiß")]),
            ("age", [Value.Of(34L), Value.Of(8L), m, Value.Of(71L), Value.Of(45L)]),
            ("fare", [Value.Of(24.5), Value.Of(12.0), Value.Of(30.0), Value.Of(-24.5), Value.Of(18.25)]),
            ("note", [Value.Of("window seat"), m, Value.Of("bike"), m, Value.Of("refund pending")]),
            ("is_child", [Value.Of(false), Value.Of(true), Value.Of(false), Value.Of(false), Value.Of(false)]));
    }

    public static Table Sailings(Mode mode) => Build(mode, 3,
        ("sailing_id", [Value.Of(10L), Value.Of(11L), Value.Of(12L)]),
        ("route", [Value.Of("Nordhafen–Ostkai"), Value.Of("Ostkai–Insel"), Value.Of("Insel–Nordhafen")]));

    public static Table Build(Mode mode, int rows, params (string Name, Value[] Values)[] columns)
    {
        var names = new string[columns.Length];
        var cols = new Column[columns.Length];
        for (var i = 0; i < columns.Length; i++)
        {
            names[i] = columns[i].Name;
            var vals = (Value[])columns[i].Values.Clone();
            // Each mode reads a missing cell with its own marker.
            for (var r = 0; r < vals.Length; r++)
                if (vals[r].IsMissing) vals[r] = mode.IsNull ? Value.Null : Value.NaN;
            cols[i] = ColumnFactory.FromValues(vals, mode);
        }
        return new Table(names, cols, rows);
    }

    public const string TicketsCsv =
        "ticket_id,sailing_id,passenger,age,fare,paid_at,note,is_child\n" +
        "1,10,Zoë Brandt,34,24.5,2026-05-01T08:00:00Z,window seat,false\n" +
        "2,10,Σοφία Παππά,8,12.0,2026-05-01T08:05:00Z,,true\n" +
        "3,11,山田 花子,,30.0,2026-05-02T09:00:00Z,bike,false\n" +
        "4,11,Ola 🚢,71,-24.5,2026-05-02T09:10:00Z,,false\n" +
        "5,12,Jörg Weiß,45,18.25,2026-05-03T10:00:00Z,refund pending,false\n";

    public const string SailingsCsv =
        "sailing_id,route\n10,Nordhafen–Ostkai\n11,Ostkai–Insel\n12,Insel–Nordhafen\n";

    private static readonly Lazy<string> Folder = new(() =>
    {
        var dir = Path.Combine(Path.GetTempPath(), "parity-interp-tests-" + Environment.ProcessId.ToString(System.Globalization.CultureInfo.InvariantCulture));
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "tickets.csv"), TicketsCsv);
        File.WriteAllText(Path.Combine(dir, "sailings.csv"), SailingsCsv);
        return dir;
    });

    public static string Dir => Folder.Value;

    /// <summary>Parses and runs <paramref name="script"/> after loading tickets and sailings from CSV.</summary>
    public static ModeRun Run(string script, Mode mode, Dictionary<string, Table>? frames = null)
    {
        if (frames is not null)
        {
            var p = ScriptParser.Parse(script, "test.parity");
            return Interpreter.Run(p.Script, mode, frames);
        }
        var text = "load tickets from 'tickets.csv'\nload sailings from 'sailings.csv'\n" + script;
        var parsed = ScriptParser.Parse(text, "test.parity");
        Assert.False(parsed.HasErrors, string.Join("\n", parsed.Diagnostics.Select(d => d.Format())));
        return Interpreter.Run(parsed.Script, mode, Dir, new RunOptions { Root = Dir });
    }

    /// <summary>Runs and expects success; returns the checkpoint tables by label.</summary>
    public static ModeRun Ok(string script, Mode mode, Dictionary<string, Table>? frames = null)
    {
        var run = Run(script, mode, frames);
        Assert.True(run.Failure is null, run.Failure?.Format());
        return run;
    }

    public static Table Check(this ModeRun run, string label) =>
        run.FindCheckpoint(label)?.Table ?? throw new InvalidOperationException("no checkpoint " + label);

    public static Value[] Col(this Table t, string name)
    {
        var c = t[name];
        var v = new Value[c.Length];
        for (var i = 0; i < v.Length; i++) v[i] = c.GetValue(i);
        return v;
    }

    public static string Type(this Table t, string name) => t[name].TypeLabel;

    /// <summary>Runs and expects a failure with <paramref name="code"/>; returns it.</summary>
    public static Parity.Script.Diagnostics.Diagnostic Fails(string script, Mode mode, string code)
    {
        var run = Run(script, mode);
        Assert.True(run.Failure is not null, "expected " + code);
        Assert.Equal(code, run.Failure!.Code);
        return run.Failure;
    }
}
