using System.Globalization;
using FsCheck.Xunit;
using Parity.Engine.Frames;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Script.Parsing;
using Parity.Script.Running;

namespace Parity.Tests.Script.Running;

/// <summary>
/// <c>order by … take N</c> in one derivation gathers only the first N rows of the sort permutation. It must give
/// exactly the rows of a full stable sort followed by <c>take N</c> (spec §2.2 "Ordering": missing last in both
/// directions, ties in input order, strings in code point order), which the scripts here get by sorting in one
/// statement and taking in the next, so the interpreter cannot fuse the two.
/// </summary>
public sealed class TopNTests
{
    private static readonly Mode[] Modes = [Mode.Legacy, Mode.Modern, Harbor.ArrowNanAlias, Harbor.BoxedNullAlias];

    // Code point order differs from UTF-16 order between U+FF21 and an emoji (a surrogate pair): a string kernel
    // that compared UTF-16 units would put the emoji first.
    private static readonly string[] Words = ["Ola", "ola", "Zoë", "Σοφία", "山田", "\uFF21", "🚢", "Öz", ""];

    [Fact]
    public void Keeps_missing_last_and_ties_in_input_order_when_descending()
    {
        foreach (var mode in Modes)
        {
            var run = Harbor.Ok("let a = tickets order by age desc take 4\ncheck a\n", mode);
            // ages 34, 8, missing, 71, 45: descending 71, 45, 34, 8, then the missing age last.
            Assert.Equal([4L, 5L, 1L, 2L], run.Check("a").Col("ticket_id").Select(v => v.Int64));
            var all = Harbor.Ok("let a = tickets order by age desc take 9\ncheck a\n", mode);
            Assert.Equal([4L, 5L, 1L, 2L, 3L], all.Check("a").Col("ticket_id").Select(v => v.Int64));
        }
    }

    [Fact]
    public void Take_zero_and_a_take_after_skip_still_work()
    {
        foreach (var mode in Modes)
        {
            var run = Harbor.Ok("let a = tickets order by fare take 0\nlet b = tickets order by fare take 3 skip 1\ncheck a\ncheck b\n", mode);
            Assert.Equal(0, run.Check("a").RowCount);
            // fares -24.5 (4), 12.0 (2), 18.25 (5), 24.5 (1), 30.0 (3): the first three, then skip one.
            Assert.Equal([2L, 5L], run.Check("b").Col("ticket_id").Select(v => v.Int64));
        }
    }

    [Property(MaxTest = 60)]
    public bool Equals_a_full_sort_then_take(int seed)
    {
        var rng = new Random(seed);
        var rows = rng.Next(0, 40);
        var n = rng.Next(0, rows + 3);
        var keyCount = rng.Next(1, 4);
        var keys = new List<string>();
        var pool = new List<string> { "k_int", "k_str", "k_float", "k_bool" };
        for (var i = 0; i < keyCount; i++)
        {
            var k = pool[rng.Next(pool.Count)];
            pool.Remove(k);
            keys.Add(k + (rng.Next(2) == 0 ? " desc" : ""));
        }
        var order = string.Join(", ", keys);
        var script = $"let a = t order by {order} take {n.ToString(CultureInfo.InvariantCulture)}\n"
            + $"let s = t order by {order}\nlet b = s take {n.ToString(CultureInfo.InvariantCulture)}\ncheck a\ncheck b\n";
        foreach (var mode in Modes)
        {
            var ints = new Value[rows];
            var strs = new Value[rows];
            var floats = new Value[rows];
            var bools = new Value[rows];
            var ids = new Value[rows];
            for (var r = 0; r < rows; r++)
            {
                // Few distinct values, so ties are common; about one cell in five missing.
                ints[r] = rng.Next(5) == 0 ? Value.Null : Value.Of((long)rng.Next(-3, 4));
                strs[r] = rng.Next(5) == 0 ? Value.Null : Value.Of(Words[rng.Next(Words.Length)]);
                floats[r] = rng.Next(5) == 0 ? Value.Null : Value.Of(rng.Next(-2, 3) * 0.5);
                bools[r] = rng.Next(5) == 0 ? Value.Null : Value.Of(rng.Next(2) == 0);
                ids[r] = Value.Of((long)r);
            }
            var t = Harbor.Build(mode, rows, ("id", ids), ("k_int", ints), ("k_str", strs), ("k_float", floats), ("k_bool", bools));
            var parsed = ScriptParser.Parse(script, "test.parity");
            var run = Interpreter.Run(parsed.Script, mode, new Dictionary<string, Table> { ["t"] = t });
            if (run.Failure is not null) throw new InvalidOperationException(run.Failure.Format() + "\n" + script);
            if (!Same(run.Check("a"), run.Check("b"))) return false;
        }
        return true;
    }

    private static bool Same(Table a, Table b)
    {
        if (a.RowCount != b.RowCount || !a.Names.SequenceEqual(b.Names)) return false;
        foreach (var name in a.Names)
        {
            if (a[name].TypeLabel != b[name].TypeLabel) return false;
            if (!a.Col(name).SequenceEqual(b.Col(name))) return false;
        }
        return true;
    }
}
