using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Tests.Script.Running;

public sealed class SmokeTests
{
    [Fact]
    public void Runs_a_derivation_and_a_checkpoint()
    {
        var run = Harbor.Ok("let adults = tickets where age >= 18 select passenger, fare order by fare desc\ncheck adults", Mode.Modern);
        var t = run.Check("adults");
        Assert.Equal(3, t.RowCount);
        Assert.Equal(Value.Of(24.5), t.Col("fare")[0]);
    }
}
