using System.Diagnostics;
using System.Globalization;
using System.Text;
using Parity.Engine.Modes;
using Parity.Script.Parsing;
using Parity.Script.Running;
using Parity.Tests.Engine.IO;
using Xunit.Abstractions;

namespace Parity.Tests.Reliability;

/// <summary>
/// Random and mutated scripts through <see cref="ScriptParser.Parse"/> and then <see cref="Interpreter.Run"/>
/// on the Harbor Line fixtures in legacy and modern: each ends in a parse diagnostic, a run to the end or a
/// located run-time error (spec §3.5) with a code other than E-INTERNAL; never a throw, a hang or runaway memory.
/// </summary>
public sealed class ScriptFuzzTests(ITestOutputHelper output)
{
    private const string Loads = """
        load tickets from '../harbor/tickets.csv'
        load sailings from '../harbor/sailings.parquet'
        load routes from '../harbor/routes.arrow'

        """;

    private static readonly Dictionary<string, string[]> Columns = new(StringComparer.Ordinal)
    {
        ["tickets"] = ["ticket_id", "sailing_id", "passenger", "age", "fare", "paid_at", "note", "is_child"],
        ["sailings"] = ["sailing_id", "route_id", "departs_at", "vessel", "capacity", "cancelled"],
        ["routes"] = ["route_id", "name", "from_pier", "to_pier", "km"],
    };

    private static readonly string[] Literals =
    [
        "0", "1", "-1", "18", "2.5", "0.0", "9223372036854775807", "'Åsa'", "'ζ'", "'🚢'", "''", "'it''s'", "true", "false", "null",
    ];

    private static readonly string[] Functions =
    [
        "length", "upper", "lower", "trim", "text", "abs", "type_of", "coalesce", "round", "substring", "replace", "contains", "starts_with", "ends_with",
    ];

    private static readonly string[] Aggregates = ["count", "sum", "avg", "min", "max", "first", "count_distinct"];

    private static readonly RunOptions Options = RunOptions.Default with
    {
        Root = TestFiles.RepoRoot,
        MaxRows = 2_000_000,
        MaxStringBytes = 1 << 20,
    };

    [Fact]
    public void Random_scripts_parse_and_run_or_fail_with_a_located_error()
    {
        var random = new Random(424242);
        var tally = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var clock = Stopwatch.StartNew();
        for (var n = 0; Fuzz.More(n, 260, clock); n++)
            RunOne(new Generator(random).Script(), n, tally);
        output.WriteLine(Fuzz.Summary("random scripts", tally));
        Assert.True(tally.ContainsKey("ok"), "some random scripts run to the end");
    }

    [Fact]
    public void Mutated_demo_scripts_parse_and_run_or_fail_with_a_located_error()
    {
        var sources = new List<string>();
        foreach (var path in Directory.GetFiles(TestFiles.Fixture("scripts"), "*.parity"))
            sources.Add(File.ReadAllText(path, Encoding.UTF8));
        Assert.NotEmpty(sources);
        string[] pieces = ["'", "\"", "(", ")", ",", "\\\n", "\n", " where ", " join tickets on fare", " || ", " take 0", " skip 99999",
            " order by passenger desc", " distinct", " cast fare to int64", "null", "🚢", "\u0000", " / 0", " % 0", "#"];
        var random = new Random(99);
        var tally = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var clock = Stopwatch.StartNew();
        for (var n = 0; Fuzz.More(n, 200, clock); n++)
        {
            var text = new StringBuilder(sources[random.Next(sources.Count)]);
            var edits = random.Next(1, 5);
            for (var e = 0; e < edits && text.Length > 0; e++)
            {
                var at = random.Next(text.Length);
                switch (random.Next(3))
                {
                    case 0: text.Remove(at, Math.Min(random.Next(1, 8), text.Length - at)); break;
                    case 1: text.Insert(at, pieces[random.Next(pieces.Length)]); break;
                    default: text[at] = (char)random.Next(32, 127); break;
                }
            }
            RunOne(text.ToString(), n, tally);
        }
        output.WriteLine(Fuzz.Summary("mutated scripts", tally));
        Assert.True(tally.Count > 1, "mutations give several outcomes");
    }

    private static void RunOne(string text, int n, SortedDictionary<string, int> tally)
    {
        var dir = TestFiles.Fixture("scripts");
        string Describe()
        {
            var keep = Path.Combine(Path.GetTempPath(), "parity-fuzz-failure.parity");
            File.WriteAllText(keep, text);
            return "script #" + n.ToString(CultureInfo.InvariantCulture) + " saved to " + keep + ":\n" + text;
        }
        var outcome = Fuzz.Outcome(() =>
        {
            var parsed = ScriptParser.Parse(text, "fuzz.parity");
            if (parsed.HasErrors)
            {
                foreach (var d in parsed.Diagnostics)
                    Assert.True(d.Span.LineNumber >= 1 && d.Span.ColumnNumber >= 1, "unlocated diagnostic " + d.Format());
                return "parse-error";
            }
            var codes = new List<string>();
            foreach (var mode in new[] { Mode.Legacy, Mode.Modern })
            {
                var run = Interpreter.Run(parsed.Script, mode, dir, Options);
                if (run.Failure is { } f)
                {
                    Assert.True(f.Code != Parity.Engine.Errors.ErrorCodes.Internal, "internal error in " + mode.Name + ": " + f.Format() + "\n" + Describe());
                    Assert.True(f.Span.LineNumber >= 1, "unlocated run-time error " + f.Format());
                    codes.Add(f.Code);
                }
            }
            return codes.Count == 0 ? "ok" : string.Join("|", codes.Distinct());
        }, Describe);
        Fuzz.Tally(tally, outcome);
    }

    /// <summary>A small grammar of well-formed statements over the Harbor Line frames (spec §3).</summary>
    private sealed class Generator(Random random)
    {
        private readonly Dictionary<string, string> _frames = new(StringComparer.Ordinal)
        {
            ["tickets"] = "tickets", ["sailings"] = "sailings", ["routes"] = "routes",
        };

        private int _next;

        public string Script()
        {
            var sb = new StringBuilder(Loads);
            var statements = random.Next(2, 8);
            for (var i = 0; i < statements; i++) sb.Append(Statement()).Append('\n');
            return sb.ToString();
        }

        private string Pick(IReadOnlyList<string> items) => items[random.Next(items.Count)];

        private string Statement()
        {
            var frame = Pick([.. _frames.Keys]);
            var base_ = _frames[frame];
            switch (random.Next(4))
            {
                case 0:
                case 1:
                {
                    var name = "f" + (_next++).ToString(CultureInfo.InvariantCulture);
                    var (text, kind) = Derivation(frame, base_);
                    _frames[name] = kind;
                    return "let " + name + " = " + text;
                }
                case 2:
                {
                    var target = random.Next(4) == 0 ? "(" + Derivation(frame, base_).Text + ")" : frame;
                    var where = random.Next(2) == 0 ? " where " + Expr(base_, 2) : "";
                    return "set " + target + "." + Pick(Columns[base_]) + " = " + Expr(base_, 2) + where;
                }
                default:
                    return "check " + frame + (random.Next(2) == 0 ? " as 'c" + (_next++).ToString(CultureInfo.InvariantCulture) + "'" : "");
            }
        }

        private (string Text, string Kind) Derivation(string frame, string kind)
        {
            var sb = new StringBuilder(frame);
            var clauses = random.Next(1, 4);
            for (var i = 0; i < clauses; i++)
            {
                var c = Pick(Columns[kind]);
                switch (random.Next(12))
                {
                    case 0: sb.Append(" where ").Append(Expr(kind, 3)); break;
                    case 1: sb.Append(random.Next(2) == 0 ? " take " : " skip ").Append(random.Next(0, 500)); break;
                    case 2: sb.Append(" order by ").Append(c).Append(random.Next(2) == 0 ? " desc" : ""); break;
                    case 3: sb.Append(" distinct ").Append(c); break;
                    case 4: sb.Append(" fill ").Append(c).Append(" with ").Append(Pick(Literals)); break;
                    case 5: sb.Append(" drop missing"); break;
                    case 6: sb.Append(" cast ").Append(c).Append(" to ").Append(Pick(["int64", "float64", "bool", "string", "timestamp"])); break;
                    case 7: sb.Append(" add x").Append(random.Next(3)).Append(" = ").Append(Expr(kind, 3)); break;
                    case 8:
                    {
                        var other = Pick([.. Columns.Keys]);
                        var shared = Columns[kind].Intersect(Columns[other]).ToArray();
                        if (shared.Length == 0) break;
                        sb.Append(" join ").Append(other).Append(" on ").Append(Pick(shared)).Append(random.Next(2) == 0 ? " left" : "");
                        return (sb.ToString(), kind);
                    }
                    case 9: sb.Append(" append ").Append(kind); break;
                    case 10: sb.Append(" column ").Append(c); return (sb.ToString(), kind);
                    default:
                        sb.Append(" group by ").Append(c).Append(" compute n = count(), a = ")
                            .Append(Pick(Aggregates)).Append('(').Append(Pick(Columns[kind])).Append(')');
                        return (sb.ToString(), kind);
                }
            }
            return (sb.ToString(), kind);
        }

        private string Expr(string kind, int depth)
        {
            if (depth == 0 || random.Next(3) == 0)
                return random.Next(2) == 0 ? Pick(Columns[kind]) : Pick(Literals);
            switch (random.Next(6))
            {
                case 0: return Expr(kind, depth - 1) + " " + Pick(["+", "-", "*", "/", "%", "||"]) + " " + Expr(kind, depth - 1);
                case 1: return Expr(kind, depth - 1) + " " + Pick(["=", "<>", "<", "<=", ">", ">="]) + " " + Expr(kind, depth - 1);
                case 2: return "(" + Expr(kind, depth - 1) + " " + Pick(["and", "or"]) + " " + Expr(kind, depth - 1) + ")";
                case 3: return Pick(["not ", "-"]) + "(" + Expr(kind, depth - 1) + ")";
                case 4: return Expr(kind, depth - 1) + Pick([" is null", " is not null"]);
                default:
                {
                    var f = Pick(Functions);
                    var args = f switch
                    {
                        "substring" or "replace" => 3,
                        "round" or "contains" or "starts_with" or "ends_with" => 2,
                        "coalesce" => random.Next(1, 4),
                        _ => 1,
                    };
                    var parts = new string[args];
                    for (var i = 0; i < args; i++) parts[i] = Expr(kind, depth - 1);
                    return f + "(" + string.Join(", ", parts) + ")";
                }
            }
        }
    }
}
