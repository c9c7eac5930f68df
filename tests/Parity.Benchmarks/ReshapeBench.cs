using System.Globalization;
using System.Text;
using BenchmarkDotNet.Attributes;
using Parity.Engine.Columns;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Script.Parsing;
using Parity.Script.Running;
using Parity.Script.Syntax;

namespace Parity.Benchmarks;

/// <summary>
/// Spec §2.2: under cow, derivations that keep the row set (rename, add, select, cast to the same type, a take of
/// every row, column) cost O(columns); under alias they copy eagerly. One chain of those six clauses on a
/// frame of <see cref="Rows"/> rows and 20 columns (18 numeric, 2 Arrow strings), alias against cow.
/// </summary>
[MemoryDiagnoser]
public class ReshapeBench
{
    private const int Columns = 20;
    private ScriptNode _script = null!;
    private Dictionary<string, Table> _frames = null!;

    [Params(300_000, 3_000_000)]
    public int Rows { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var names = new string[Columns];
        var cols = new Column[Columns];
        for (var c = 0; c < Columns; c++)
        {
            names[c] = "c" + c.ToString(CultureInfo.InvariantCulture);
            if (c >= Columns - 2)
            {
                var b = new Utf8ColumnBuilder(Rows, Rows * 6);
                for (var r = 0; r < Rows; r++) b.Append(r % 3 == 0 ? "Zoë" : r % 3 == 1 ? "Σοφία" : "🚢 pass");
                cols[c] = b.Build(MissingMarker.Null);
            }
            else if (c % 2 == 0)
            {
                var d = new long[Rows];
                for (var r = 0; r < Rows; r++) d[r] = r * (c + 1L);
                cols[c] = new Int64Column(d, MissingMarker.Null);
            }
            else
            {
                var d = new double[Rows];
                for (var r = 0; r < Rows; r++) d[r] = r * 0.5 + c;
                cols[c] = new Float64Column(d, MissingMarker.Null);
            }
        }
        _frames = new Dictionary<string, Table> { ["t"] = new Table(names, cols, Rows) };
        var select = new StringBuilder("k0, extra");
        for (var c = 1; c < Columns; c++) select.Append(CultureInfo.InvariantCulture, $", c{c}");
        var text = $"let r = t rename c0 to k0 add extra = c1 select {select} cast c1 to float64 take {Rows.ToString(CultureInfo.InvariantCulture)} column c1\ncheck r";
        _script = ScriptParser.Parse(text, "reshape.parity").Script;
    }

    [Benchmark(Baseline = true)]
    public int Alias() => Run(new Mode(StringStorage.Arrow, MissingMarker.Null, WriteSemantics.Alias));

    [Benchmark]
    public int Cow() => Run(Mode.Modern);

    private int Run(Mode mode)
    {
        var run = Interpreter.Run(_script, mode, _frames);
        if (run.Failure is not null) throw new InvalidOperationException(run.Failure.Format());
        return run.Checkpoints[0].Table.RowCount;
    }
}
