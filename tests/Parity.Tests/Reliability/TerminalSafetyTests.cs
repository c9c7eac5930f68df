namespace Parity.Tests.Reliability;

/// <summary>
/// Data values, column names, labels and paths are untrusted: what <c>show</c>, the terminal summary and the
/// error messages print holds no raw control characters (ANSI escape sequences, C1 controls, carriage
/// returns, bells), so a hostile CSV cannot repaint or hijack a terminal. Checked end to end through the CLI.
/// </summary>
public sealed class TerminalSafetyTests : IDisposable
{
    // ESC [ 2 J clears the screen; ESC ] 0 ; sets the window title; U+009B is the one-character C1 CSI.
    private const string Hostile = "ticket_id,passenger,\"age\u001b[31m\"\n"
        + "1,\"\u001b[2J\u001b[HÅsa\",34\n"
        + "2,\"bell\u0007\rover\u009b6n\",\n"
        + "3,\"\u001b]0;owned\u0007Νίκος\",71\n";

    private readonly CliSandbox _box = new();

    public TerminalSafetyTests()
    {
        _box.Write("ferry/tickets.csv", Hostile);
        _box.Write("ferry/show.parity", "load tickets from 'tickets.csv'\nlet t2 = tickets add shown = text(\"age\u001b[31m\")\ncheck t2 as 'label\u001b[5m'\n");
    }

    public void Dispose() => _box.Dispose();

    /// <summary>True when <paramref name="text"/> has a control character other than newline and tab (C0, DEL, C1).</summary>
    private static void AssertNoControls(string text, string what)
    {
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            var control = (c < 0x20 && c != '\n' && c != '\t') || (c >= 0x7F && c <= 0x9F);
            Assert.False(control, what + " has a raw control character U+" + ((int)c).ToString("X4", System.Globalization.CultureInfo.InvariantCulture) + " at " + i.ToString(System.Globalization.CultureInfo.InvariantCulture) + ": " + text);
        }
    }

    [Fact]
    public void Show_neutralises_control_characters_in_values_and_names()
    {
        foreach (var mode in new[] { "legacy", "modern" })
        {
            var (exit, output, err) = _box.Cli("show", "ferry/show.parity", "--checkpoint", "label\u001b[5m", "--mode", mode);
            Assert.Equal(0, exit);
            AssertNoControls(output, "show table");
            AssertNoControls(err, "show errors");
            Assert.Contains("Åsa", output, StringComparison.Ordinal);
            Assert.Contains("Νίκος", output, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void The_terminal_summary_neutralises_control_characters()
    {
        // The age column has a missing value, so its type differs between modes (spec §2.1) and the summary
        // names the hostile column and label.
        var (exit, output, err) = _box.Cli("run", "ferry/show.parity");
        Assert.Equal(1, exit);
        AssertNoControls(output, "summary");
        AssertNoControls(err, "stderr");
        Assert.Contains("age", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Error_messages_neutralise_control_characters_from_scripts()
    {
        _box.Write("ferry/bad.parity", "load tickets from 'no\u001b[2Jsuch.csv'\ncheck tickets\n");
        var (exit, output, err) = _box.Cli("run", "ferry/bad.parity");
        Assert.Equal(2, exit);
        AssertNoControls(output, "stdout");
        AssertNoControls(err, "stderr");
        Assert.Contains("E-FILE-NOT-FOUND", err, StringComparison.Ordinal);
    }
}
