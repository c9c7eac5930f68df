using System.Text.Json;
using Parity.Cli;
using Parity.Engine.Modes;

namespace Parity.Tests.Reports;

/// <summary><c>parity show</c> run in-process on a small Harbor Line script.</summary>
public sealed class ShowCommandTests : IDisposable
{
    private const string TicketsCsv =
        "ticket_id,passenger,age,fare\n" +
        "1,Zoë Brandt,34,24.5\n" +
        "2,山田 花子,,12.0\n" +
        "3,Ola 🚢,71,-24.5\n";

    private const string Script =
        "load tickets from 'tickets.csv'\n" +
        "check tickets as 'all tickets'\n" +
        "let ages = tickets cast age to int64\n" +
        "check ages\n";

    private readonly string _dir = Path.Combine(Path.GetTempPath(), "parity-show-" + Guid.NewGuid().ToString("N"));

    public ShowCommandTests()
    {
        Directory.CreateDirectory(_dir);
        File.WriteAllText(Path.Combine(_dir, "tickets.csv"), TicketsCsv);
        File.WriteAllText(Path.Combine(_dir, "tickets.parity"), Script);
    }

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private (int Code, string Out, string Err) Run(params string[] args)
    {
        using var output = new StringWriter { NewLine = "\n" };
        using var error = new StringWriter { NewLine = "\n" };
        var code = CliApp.Run(["show", .. args], new CliContext(output, error, _dir));
        return (code, output.ToString(), error.ToString());
    }

    // Spec §4 and §2.1: the default mode is modern; integers with missing stay int64 with nulls.
    [Fact]
    public void Prints_the_checkpoint_as_a_table_in_modern_by_default()
    {
        var (code, output, error) = Run("tickets.parity", "--checkpoint", "all tickets");
        Assert.Equal(0, code);
        Assert.Equal("", error);
        var lines = output.Split('\n');
        Assert.Equal("ticket_id  passenger     age    fare", lines[0]);
        Assert.Equal("int64      utf8          int64  float64", lines[1]);
        Assert.Equal("        2  '山田 花子'    null     12.0", lines[4]); // numbers right-aligned; CJK counts 2 columns
        Assert.Equal("(3 rows)", lines[6]);
    }

    // Spec §2.1: under nan modes integers with missing become float64 with NaN; boxed strings are object.
    [Fact]
    public void Legacy_shows_float_ages_and_object_strings()
    {
        var (code, output, _) = Run("tickets.parity", "--checkpoint", "all tickets", "--mode", "legacy");
        Assert.Equal(0, code);
        var lines = output.Split('\n');
        Assert.Equal("int64      object        float64  float64", lines[1]);
        Assert.Contains("NaN", lines[4], StringComparison.Ordinal);
    }

    // Spec §4: show --json prints {"label", "mode", "columns": [{"name", "type"}], "rows": [[cell, ...], ...]}.
    [Theory]
    [InlineData("legacy", "legacy", "float64", "NaN")]
    [InlineData("modern", "modern", "int64", "null")]
    [InlineData("ARROW+nan+alias", "arrow+nan+alias", "float64", "NaN")]
    public void Prints_json(string modeArg, string modeName, string ageType, string missing)
    {
        var (code, output, error) = Run("tickets.parity", "--checkpoint", "all tickets", "--mode", modeArg, "--json");
        Assert.Equal(0, code);
        Assert.Equal("", error);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        Assert.Equal(["label", "mode", "columns", "rows"], root.EnumerateObject().Select(p => p.Name));
        Assert.Equal("all tickets", root.GetProperty("label").GetString());
        Assert.Equal(modeName, root.GetProperty("mode").GetString());
        Assert.Equal(ageType, root.GetProperty("columns")[2].GetProperty("type").GetString());
        Assert.Equal("age", root.GetProperty("columns")[2].GetProperty("name").GetString());
        var rows = root.GetProperty("rows");
        Assert.Equal(3, rows.GetArrayLength());
        Assert.Equal("山田 花子", rows[1][1].GetString());
        Assert.Equal(missing, rows[1][2].GetProperty("missing").GetString());
        Assert.Equal(34, rows[0][2].GetDouble());
        Assert.Equal(-24.5, rows[2][3].GetDouble());
        Assert.Equal(1, rows[0][0].GetInt64());
    }

    // Spec §2.2: cast to int64 with missing values is E-CAST under nan; the checkpoint after it is never reached.
    [Fact]
    public void A_mode_that_failed_before_the_checkpoint_exits_2_with_its_diagnostic()
    {
        var (code, output, error) = Run("tickets.parity", "--checkpoint", "ages", "--mode", "legacy");
        Assert.Equal(2, code);
        Assert.Equal("", output);
        Assert.Contains("tickets.parity:3:", error, StringComparison.Ordinal);
        Assert.Contains("error E-CAST", error, StringComparison.Ordinal);
        Assert.Contains("stopped before reaching checkpoint 'ages'", error, StringComparison.Ordinal);

        var (modern, modernOut, _) = Run("tickets.parity", "--checkpoint", "ages");
        Assert.Equal(0, modern);
        Assert.StartsWith("ticket_id  passenger", modernOut, StringComparison.Ordinal);
    }

    [Fact]
    public void Unknown_label_exits_2_listing_the_labels()
    {
        var (code, output, error) = Run("tickets.parity", "--checkpoint", "adults");
        Assert.Equal(2, code);
        Assert.Equal("", output);
        Assert.Equal("tickets.parity: error E-USAGE: no checkpoint 'adults'; its checkpoints: 'all tickets', 'ages'\n", error);
    }

    [Fact]
    public void Bad_mode_exits_2_listing_the_valid_spellings()
    {
        var (code, _, error) = Run("tickets.parity", "--checkpoint", "ages", "--mode", "utf8+nan+alias");
        Assert.Equal(2, code);
        Assert.Contains("'utf8+nan+alias' is not a mode", error, StringComparison.Ordinal);
        Assert.Contains(Mode.ValidSpellings, error, StringComparison.Ordinal);
    }

    // Spec §3.5: every error names file, line and column; the parser reports every error, not just the first.
    [Fact]
    public void Parse_errors_print_every_diagnostic_and_exit_2()
    {
        File.WriteAllText(Path.Combine(_dir, "broken.parity"), "load tickets from 'tickets.csv'\nlet = tickets where\ncheck tickets\nlet x tickets\n");
        var (code, output, error) = Run("broken.parity", "--checkpoint", "tickets");
        Assert.Equal(2, code);
        Assert.Equal("", output);
        var lines = error.TrimEnd('\n').Split('\n');
        Assert.True(lines.Length >= 2, error);
        Assert.All(lines, l => Assert.Matches(@"^broken\.parity:\d+:\d+: error E-[A-Z-]+: ", l));
        Assert.Contains(lines, l => l.StartsWith("broken.parity:2:", StringComparison.Ordinal));
        Assert.Contains(lines, l => l.StartsWith("broken.parity:4:", StringComparison.Ordinal));
    }

    [Fact]
    public void Missing_checkpoint_option_or_script_is_a_usage_error()
    {
        Assert.Equal(2, Run("tickets.parity").Code);
        var (code, _, error) = Run("nowhere.parity", "--checkpoint", "ages");
        Assert.Equal(2, code);
        Assert.StartsWith("nowhere.parity: error E-FILE-NOT-FOUND", error, StringComparison.Ordinal);
    }
}
