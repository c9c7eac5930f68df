namespace Parity.Tests.Reliability;

/// <summary>
/// The path rule (docs/reliability.md): a <c>load</c> path resolves against the script's folder and may not
/// leave the project root (<c>--root</c>, default the working directory) unless <c>--allow-outside-root</c>;
/// symbolic links count where they lead. Checked end to end through the CLI.
/// </summary>
public sealed class PathRuleTests : IDisposable
{
    private const string Csv = "ticket_id,passenger\n1,Åsa\n2,Νίκος\n";

    private readonly CliSandbox _box = new();

    public PathRuleTests()
    {
        _box.Write("outside/secret.csv", Csv);
        _box.Write("project/ferry/tickets.csv", Csv);
    }

    public void Dispose() => _box.Dispose();

    private string Project => _box.PathOf("project");

    private (int Exit, string Out, string Err) Run(string loadPath, params string[] extra)
    {
        File.WriteAllText(Path.Combine(Project, "ferry", "load.parity"), "load t from '" + loadPath + "'\ncheck t\n");
        return CliSandbox.CliIn(Project, ["run", "ferry/load.parity", .. extra]);
    }

    [Fact]
    public void A_path_inside_the_root_loads()
    {
        var (exit, _, err) = Run("tickets.csv");
        Assert.NotEqual(2, exit);
        Assert.Equal("", err);
    }

    [Fact]
    public void Dot_dot_out_of_the_root_is_refused_naming_the_path_the_root_and_the_way_out()
    {
        var (exit, _, err) = Run("../../outside/secret.csv");
        Assert.Equal(2, exit);
        Assert.Contains("ferry/load.parity:1:13: error E-PATH:", err, StringComparison.Ordinal);
        Assert.Contains("'../../outside/secret.csv'", err, StringComparison.Ordinal);
        Assert.Contains("'" + Project + "'", err, StringComparison.Ordinal);
        Assert.Contains("--allow-outside-root", err, StringComparison.Ordinal);
        Assert.Contains("--root", err, StringComparison.Ordinal);
    }

    [Fact]
    public void An_absolute_path_outside_the_root_is_refused()
    {
        var (exit, _, err) = Run(_box.PathOf("outside/secret.csv"));
        Assert.Equal(2, exit);
        Assert.Contains("E-PATH", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Allow_outside_root_and_a_wider_root_let_it_load()
    {
        Assert.NotEqual(2, Run("../../outside/secret.csv", "--allow-outside-root").Exit);
        Assert.NotEqual(2, Run("../../outside/secret.csv", "--root", "..").Exit);
    }

    [Fact]
    public void A_narrower_root_refuses_what_the_working_directory_would_allow()
    {
        Directory.CreateDirectory(Path.Combine(Project, "scripts"));
        var (exit, _, err) = Run("tickets.csv", "--root", "scripts");
        Assert.Equal(2, exit);
        Assert.Contains("E-PATH", err, StringComparison.Ordinal);
    }

    [Fact]
    public void A_symbolic_link_to_a_file_outside_counts_as_outside()
    {
        File.CreateSymbolicLink(Path.Combine(Project, "ferry", "link.csv"), _box.PathOf("outside/secret.csv"));
        var (exit, _, err) = Run("link.csv");
        Assert.Equal(2, exit);
        Assert.Contains("E-PATH", err, StringComparison.Ordinal);
        Assert.Contains("symbolic link", err, StringComparison.Ordinal);
    }

    [Fact]
    public void A_symbolic_link_to_a_folder_outside_counts_as_outside()
    {
        Directory.CreateSymbolicLink(Path.Combine(Project, "ferry", "shared"), _box.PathOf("outside"));
        var (exit, _, err) = Run("shared/secret.csv");
        Assert.Equal(2, exit);
        Assert.Contains("E-PATH", err, StringComparison.Ordinal);
    }

    [Fact]
    public void A_relative_symbolic_link_that_stays_inside_loads()
    {
        Directory.CreateDirectory(Path.Combine(Project, "data"));
        File.CreateSymbolicLink(Path.Combine(Project, "data", "alias.csv"), "../ferry/tickets.csv");
        var (exit, _, err) = Run("../data/alias.csv");
        Assert.NotEqual(2, exit);
        Assert.Equal("", err);
    }

    [Fact]
    public void Show_follows_the_same_rule()
    {
        File.WriteAllText(Path.Combine(Project, "ferry", "load.parity"), "load t from '../../outside/secret.csv'\ncheck t\n");
        var refused = CliSandbox.CliIn(Project, "show", "ferry/load.parity", "--checkpoint", "t");
        Assert.Equal(2, refused.Exit);
        Assert.Contains("E-PATH", refused.Err, StringComparison.Ordinal);
        var allowed = CliSandbox.CliIn(Project, "show", "ferry/load.parity", "--checkpoint", "t", "--allow-outside-root");
        Assert.Equal(0, allowed.Exit);
        Assert.Contains("Νίκος", allowed.Out, StringComparison.Ordinal);
    }
}
