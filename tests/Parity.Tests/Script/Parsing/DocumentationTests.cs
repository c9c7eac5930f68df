using System.Text;
using Parity.Script.Parsing;
using Parity.Script.Syntax;

namespace Parity.Tests.Script.Parsing;

/// <summary>The examples in docs/language.md and the demo scripts in fixtures/scripts parse without errors.</summary>
public sealed class DocumentationTests
{
    private static string RepositoryRoot() => Path.GetFullPath(Path.Combine(ParserGoldenTests.CasesDirectory(), "..", "..", "..", "..", ".."));

    public static TheoryData<int> ParityBlocks()
    {
        var data = new TheoryData<int>();
        for (var i = 0; i < ReadBlocks().Count; i++) data.Add(i);
        return data;
    }

    [Theory]
    [MemberData(nameof(ParityBlocks))]
    public void Reference_examples_parse(int index)
    {
        var block = ReadBlocks()[index];
        var result = ScriptParser.Parse(block, "language.md#" + index);
        Assert.False(result.HasErrors, block + "\n" + string.Join("\n", result.Diagnostics));
    }

    [Fact]
    public void Reference_has_examples() => Assert.True(ReadBlocks().Count >= 7);

    [Fact]
    public void Printout_sample_in_the_reference_is_current()
    {
        var result = ScriptParser.Parse("load tickets from 't.csv'\nlet cheap = tickets where fare < 10 and not is_child\n", "t.parity");
        var printed = SyntaxPrinter.Print(result.Script).Split('\n', 2)[1];
        var doc = File.ReadAllText(Path.Combine(RepositoryRoot(), "docs", "language.md"), Encoding.UTF8);
        Assert.Contains("```\n" + printed + "```\n", doc, StringComparison.Ordinal);
    }

    public static TheoryData<string> DemoScripts()
    {
        var data = new TheoryData<string>();
        foreach (var path in Directory.GetFiles(Path.Combine(RepositoryRoot(), "fixtures", "scripts"), "*.parity").Order(StringComparer.Ordinal))
            data.Add(Path.GetFileName(path));
        return data;
    }

    [Theory]
    [MemberData(nameof(DemoScripts))]
    public void Demo_scripts_parse(string name)
    {
        var text = File.ReadAllText(Path.Combine(RepositoryRoot(), "fixtures", "scripts", name), Encoding.UTF8);
        var result = ScriptParser.Parse(text, name);
        Assert.False(result.HasErrors, string.Join("\n", result.Diagnostics));
        Assert.Contains(result.Script.Statements, s => s is CheckStatement);
    }

    /// <summary>Fenced blocks marked <c>parity</c> in docs/language.md.</summary>
    private static List<string> ReadBlocks()
    {
        var lines = File.ReadAllText(Path.Combine(RepositoryRoot(), "docs", "language.md"), Encoding.UTF8).Split('\n');
        var blocks = new List<string>();
        StringBuilder? current = null;
        foreach (var line in lines)
        {
            if (current is null && line.Trim() == "```parity")
            {
                current = new StringBuilder();
            }
            else if (current is not null && line.Trim() == "```")
            {
                blocks.Add(current.ToString());
                current = null;
            }
            else
            {
                current?.Append(line).Append('\n');
            }
        }
        return blocks;
    }
}
