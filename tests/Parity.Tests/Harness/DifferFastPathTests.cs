using Parity.Engine.Modes;
using Parity.Engine.Values;
using Parity.Harness.Diffing;
using Parity.Harness.Findings;

namespace Parity.Tests.Harness;

public sealed class DifferFastPathTests
{
    private static Value RandomCell(Random rng, int kind, Mode mode)
    {
        // Few distinct values so equal and unequal cells both occur often.
        var pick = rng.Next(8);
        if (pick == 0) return mode.IsNull ? Value.Null : (kind == 3 && mode.IsBoxed && rng.Next(2) == 0 ? Value.NoneRef : Value.NaN);
        return kind switch
        {
            0 => Value.Of((long)rng.Next(3)),
            1 => pick == 1 ? Value.Of(double.NaN) : pick == 2 ? Value.Of(-0.0) : Value.Of(rng.Next(3) * 0.5),
            2 => Value.Of(rng.Next(2) == 0),
            3 => Value.Of(pick == 3 ? "nan" : pick == 4 ? "Zoë 🚢" : pick == 5 ? "" : "fare " + rng.Next(2).ToString(System.Globalization.CultureInfo.InvariantCulture)),
            _ => Value.Timestamp(rng.Next(3) * 1_000_000L),
        };
    }

    [Fact]
    public void The_typed_fast_pass_gives_the_same_findings_as_the_generic_path()
    {
        var rng = new Random(20260601);
        var modes = Mode.All;
        for (var round = 0; round < 300; round++)
        {
            var ma = modes[rng.Next(modes.Count)];
            var mb = modes[rng.Next(modes.Count)];
            var kind = rng.Next(5);
            var kindB = rng.Next(4) == 0 ? rng.Next(2) : kind; // sometimes int64 against float64
            if (kind > 1) kindB = kind;
            var n = 1 + rng.Next(40);
            var a = new Value[n];
            var b = new Value[n];
            for (var i = 0; i < n; i++)
            {
                a[i] = RandomCell(rng, kind, ma);
                b[i] = rng.Next(3) == 0 ? RandomCell(rng, kindB, mb) : Convert(a[i], ma, mb, kindB);
            }
            Parity.Engine.Frames.Table ta, tb;
            try
            {
                ta = HarnessFixtures.Table(ma, ("c", a));
                tb = HarnessFixtures.Table(mb, ("c", b));
            }
            catch (Parity.Engine.Errors.EngineException)
            {
                continue; // a value mix the mode cannot hold (arrow strings)
            }
            var ra = HarnessFixtures.Run(ma, ("t", ta));
            var rb = HarnessFixtures.Run(mb, ("t", tb));
            var fast = ModeDiffer.Compare(ra, rb, "s", DiffOptions.Default);
            var slow = ModeDiffer.Compare(ra, rb, "s", DiffOptions.Default with { GenericOnly = true });
            Assert.Equal(Describe(slow), Describe(fast));
        }
    }

    private static Value Convert(Value v, Mode from, Mode to, int kind)
    {
        if (v.IsMissing) return to.IsNull ? Value.Null : v.Missing == MissingKind.Null ? Value.NaN : v;
        if (kind == 1 && v.Kind == ValueKind.Int64) return Value.Of((double)v.Int64);
        if (kind == 0 && v.Kind == ValueKind.Float64 && double.IsFinite(v.Float64)) return Value.Of((long)v.Float64);
        _ = from;
        return v;
    }

    private static List<string> Describe(IReadOnlyList<Finding> findings) =>
        findings.Select(f => f.Key + "#" + f.Count + "#" + f.Message + "#" + string.Join(";", f.Samples.Select(s => s.Row + "=" + string.Join("/", s.Values)))).ToList();
}
