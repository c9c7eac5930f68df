using System.Text;
using Parity.Script.Parsing;
using Parity.Script.Syntax;

namespace Parity.Tests.Script.Parsing;

/// <summary>
/// Golden tests for the language (spec §3, §3.5): every <c>Cases/*.parity</c> script is parsed and its
/// diagnostics and printed tree are compared with <c>Cases/*.expected</c>. Set PARITY_UPDATE_GOLDEN=1 to
/// rewrite the expectations instead (then review the diff before committing).
/// </summary>
public sealed class ParserGoldenTests
{
    public static TheoryData<string> CaseNames()
    {
        var data = new TheoryData<string>();
        foreach (var path in Directory.GetFiles(CasesDirectory(), "*.parity").Order(StringComparer.Ordinal))
            data.Add(Path.GetFileNameWithoutExtension(path));
        return data;
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Case_matches_its_expected_output(string name)
    {
        var scriptPath = Path.Combine(CasesDirectory(), name + ".parity");
        var expectedPath = Path.Combine(CasesDirectory(), name + ".expected");
        var actual = Render(File.ReadAllText(scriptPath, Encoding.UTF8), name + ".parity");

        if (Environment.GetEnvironmentVariable("PARITY_UPDATE_GOLDEN") == "1")
        {
            File.WriteAllText(expectedPath, actual, new UTF8Encoding(false));
            return;
        }
        Assert.True(File.Exists(expectedPath), "missing " + expectedPath + " (run with PARITY_UPDATE_GOLDEN=1 to create it)");
        var expected = File.ReadAllText(expectedPath, Encoding.UTF8).Replace("\r\n", "\n", StringComparison.Ordinal);
        if (expected != actual) Assert.Fail(GoldenDiff.Describe(name + ".expected", expected, actual));
    }

    [Fact]
    public void There_are_cases() => Assert.True(CaseNames().Count >= 20);

    /// <summary>Diagnostics (canonical text form) first, then the printed tree.</summary>
    internal static string Render(string text, string file)
    {
        var result = ScriptParser.Parse(text, file);
        var sb = new StringBuilder();
        foreach (var d in result.Diagnostics) sb.Append(d.Format()).Append('\n');
        if (result.Diagnostics.Count > 0) sb.Append("---\n");
        sb.Append(SyntaxPrinter.Print(result.Script));
        return sb.ToString();
    }

    /// <summary>The source folder (not a copy in the output folder), found by walking up to Parity.sln.</summary>
    internal static string CasesDirectory()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "Parity.sln"))) dir = dir.Parent;
        if (dir is null) throw new InvalidOperationException("Parity.sln not found above " + AppContext.BaseDirectory);
        return Path.Combine(dir.FullName, "tests", "Parity.Tests", "Script", "Parsing", "Cases");
    }
}
