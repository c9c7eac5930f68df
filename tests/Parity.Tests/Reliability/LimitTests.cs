using System.Globalization;
using System.Text;

namespace Parity.Tests.Reliability;

/// <summary>
/// Scripts that would explode stop with E-LIMIT naming the limit and the option that raises it, before
/// memory runs out (docs/reliability.md "Limits"); the limits are set on the command line.
/// </summary>
public sealed class LimitTests : IDisposable
{
    private readonly CliSandbox _box = new();

    public void Dispose() => _box.Dispose();

    private void Tickets(int rows)
    {
        var sb = new StringBuilder("ticket_id,passenger,fare\n");
        for (var i = 1; i <= rows; i++)
            sb.Append(i.ToString(CultureInfo.InvariantCulture)).Append(",Åsa ").Append((i % 7).ToString(CultureInfo.InvariantCulture)).Append(",4.5\n");
        _box.Write("ferry/tickets.csv", sb.ToString());
    }

    [Fact]
    public void A_cross_join_through_a_constant_key_stops_at_the_default_row_limit()
    {
        // 20,000 x 20,000 = 400 million rows, twice the default of 200 million: refused before allocating.
        Tickets(20_000);
        _box.Write("ferry/cross.parity", "load tickets from 'tickets.csv'\nlet keyed = tickets add k = 1\nlet all_pairs = keyed join keyed on k\ncheck all_pairs\n");
        var (exit, _, err) = _box.Cli("run", "ferry/cross.parity");
        Assert.Equal(2, exit); // spec §3.5: an error in every mode exits 2
        Assert.Contains("ferry/cross.parity:3:", err, StringComparison.Ordinal);
        Assert.Contains("E-LIMIT", err, StringComparison.Ordinal);
        Assert.Contains("400000000 rows", err, StringComparison.Ordinal);
        Assert.Contains("--max-rows", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Max_rows_on_the_command_line_lowers_and_raises_the_join_limit()
    {
        Tickets(30);
        _box.Write("ferry/cross.parity", "load tickets from 'tickets.csv'\nlet keyed = tickets add k = 1\nlet all_pairs = keyed join keyed on k\ncheck all_pairs\n");
        var low = _box.Cli("run", "ferry/cross.parity", "--max-rows", "899");
        Assert.Equal(2, low.Exit);
        Assert.Contains("E-LIMIT", low.Err, StringComparison.Ordinal);
        Assert.Contains("limit of 899", low.Err, StringComparison.Ordinal);
        var enough = _box.Cli("run", "ferry/cross.parity", "--max-rows", "900");
        Assert.NotEqual(2, enough.Exit);
        Assert.DoesNotContain("E-LIMIT", enough.Err, StringComparison.Ordinal);
    }

    [Fact]
    public void Repeated_appends_stop_at_the_row_limit()
    {
        Tickets(10);
        var script = new StringBuilder("load tickets from 'tickets.csv'\n");
        for (var i = 0; i < 12; i++) script.Append("let tickets = tickets append tickets\n");
        script.Append("check tickets\n");
        _box.Write("ferry/grow.parity", script.ToString());
        var (exit, _, err) = _box.Cli("check", "ferry/grow.parity", "--max-rows", "5000");
        Assert.Equal(2, exit);
        // 10 * 2^9 = 5120 > 5000: the ninth append (line 10) is refused.
        Assert.Contains("ferry/grow.parity:10:", err, StringComparison.Ordinal);
        Assert.Contains("E-LIMIT", err, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("set tickets.passenger = passenger || passenger", 14)] // doubles: 6 bytes * 2^14 > 65,536
    [InlineData("set tickets.passenger = replace(passenger, 'Å', 'ÅÅÅÅÅÅÅÅ')", 5)] // Å is 2 bytes: x8 per step
    [InlineData("set tickets.passenger = upper(passenger) || lower(passenger)", 14)]
    public void Growing_strings_stop_at_the_string_limit_before_memory_runs_out(string step, int failingStep)
    {
        Tickets(3);
        var script = new StringBuilder("load tickets from 'tickets.csv'\n");
        for (var i = 0; i < 40; i++) script.Append(step).Append('\n');
        script.Append("check tickets\n");
        _box.Write("ferry/grow.parity", script.ToString());
        var (exit, _, err) = _box.Cli("run", "ferry/grow.parity", "--max-string-bytes", "65536");
        Assert.Equal(2, exit);
        Assert.Contains("E-LIMIT", err, StringComparison.Ordinal);
        Assert.Contains("limit of 65536 bytes", err, StringComparison.Ordinal);
        Assert.Contains("--max-string-bytes", err, StringComparison.Ordinal);
        Assert.Contains("ferry/grow.parity:" + (failingStep + 1).ToString(CultureInfo.InvariantCulture) + ":", err, StringComparison.Ordinal);
    }

    [Fact]
    public void A_string_sum_over_a_large_group_is_measured()
    {
        Tickets(200);
        _box.Write("ferry/sum.parity", "load tickets from 'tickets.csv'\nlet all = tickets add k = 1 group by k compute names = sum(passenger)\ncheck all\n");
        // Spec §2.2: sum of strings concatenates under boxed and is E-AGG-TYPE under arrow; run boxed modes only.
        var (exit, _, err) = _box.Cli("run", "ferry/sum.parity", "--modes", "boxed+nan+alias,boxed+null+cow", "--max-string-bytes", "1000");
        Assert.Equal(2, exit);
        Assert.Contains("E-LIMIT", err, StringComparison.Ordinal);
        Assert.Contains("sum would make a string of 1200 bytes", err, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("run", "--max-rows", "0")]
    [InlineData("check", "--max-string-bytes", "-5")]
    [InlineData("accept", "--max-rows", "lots")]
    [InlineData("matrix", "--root", "no/such/folder")]
    public void Bad_limit_values_are_usage_errors(string command, string option, string value)
    {
        Tickets(3);
        _box.Write("ferry/a.parity", "load tickets from 'tickets.csv'\ncheck tickets\n");
        var (exit, _, err) = _box.Cli(command, "ferry/a.parity", option, value);
        Assert.Equal(2, exit);
        Assert.Contains("E-USAGE", err, StringComparison.Ordinal);
        Assert.Contains(option, err, StringComparison.Ordinal);
    }

    [Fact]
    public void Every_command_that_runs_scripts_takes_the_limit_options()
    {
        Tickets(3);
        _box.Write("ferry/a.parity", "load tickets from 'tickets.csv'\ncheck tickets\n");
        string[] limits = ["--max-rows", "10", "--max-string-bytes", "100", "--root", ".", "--allow-outside-root"];
        Assert.NotEqual(2, _box.Cli(["run", "ferry/a.parity", .. limits]).Exit);
        Assert.Equal(0, _box.Cli(["accept", "ferry/a.parity", .. limits]).Exit);
        Assert.Equal(0, _box.Cli(["check", "ferry/a.parity", .. limits]).Exit);
        Assert.Equal(0, _box.Cli(["show", "ferry/a.parity", "--checkpoint", "tickets", .. limits]).Exit);
        Assert.Equal(0, _box.Cli(["matrix", "ferry/a.parity", .. limits]).Exit);
    }
}
