using System.Text;
using Parity.Engine.Errors;
using Parity.Harness.Findings;
using Parity.Harness.Project;

namespace Parity.Tests.Harness.Project;

/// <summary>The project file reader: every key, comments, and a located E-CONFIG error for each kind of mistake.</summary>
public sealed class ProjectFileReaderTests
{
    private static readonly string Base = Path.Combine(Path.GetTempPath(), "parity-project");

    private static ProjectFile Parse(string json) => ProjectFileReader.Parse(Encoding.UTF8.GetBytes(json), "parity.json", Base);

    private static string Error(string json)
    {
        var e = Assert.Throws<EngineException>(() => Parse(json));
        return e.Format();
    }

    [Fact]
    public void Reads_every_key_with_comments_and_trailing_commas()
    {
        // JSON with // and /* */ comments: what System.Text.Json's comment handling skips (its documented option).
        var file = Parse("""
            // Harbor Line project
            {
              "scripts": ["pipelines/*.parity", "extra/one.parity"],
              "modes": ["legacy", "modern"],   /* the default pair */
              "golden": "snapshots",
              "out": "out/report",
              "formats": ["md", "JSON"],
              "tolerance": {"absolute": 0.001, "relative": 1e-9, "columns": {"fare*": {"absolute": 0.01}}},
              "row_limit": 500,
              "max_rows": 1000000,
              "max_string_bytes": 4096,
              "max_diff_rows": 5,
              "max_md_chars": 20000,
              "expect": [
                {"kind": "type", "from": "object", "to": "utf8", "note": "strings move to Arrow"},
                {"kind": "missing", "columns": ["note*"], "from": "NaN", "to": "null"},
              ],
            }
            """);
        Assert.Equal([Path.GetFullPath("pipelines/*.parity", Base).Replace('\\', '/'), Path.GetFullPath("extra/one.parity", Base).Replace('\\', '/')], file.Scripts);
        Assert.Equal("legacy,modern", file.Modes);
        Assert.Equal(Path.GetFullPath("snapshots", Base), file.Golden);
        Assert.Equal(Path.GetFullPath("out/report", Base), file.Out);
        Assert.Equal(["md", "json"], file.Formats);
        Assert.Equal(0.001, file.AbsoluteTolerance);
        Assert.Equal(1e-9, file.RelativeTolerance);
        Assert.Equal([new ColumnTolerance("fare*", 0.01, null)], file.ColumnTolerances);
        Assert.Equal(500, file.RowLimit);
        Assert.Equal(1_000_000, file.MaxRows);
        Assert.Equal(4096, file.MaxStringBytes);
        Assert.Equal(5, file.MaxDiffRows);
        Assert.Equal(20_000, file.MaxMarkdownChars);
        Assert.Equal(2, file.Expect.Count);
        Assert.Equal(FindingKind.Type, file.Expect[0].Kind);
        Assert.Equal("object", file.Expect[0].From);
        Assert.Equal("strings move to Arrow", file.Expect[0].Note);
        Assert.Equal("parity.json:15:5", file.Expect[0].Location);
        Assert.Equal(["note*"], file.Expect[1].Columns);
    }

    [Fact]
    public void An_empty_object_is_a_project_with_no_settings()
    {
        var file = Parse("{}");
        Assert.Null(file.Scripts);
        Assert.Null(file.Modes);
        Assert.Empty(file.Expect);
    }

    [Theory]
    [InlineData("{\n  \"fromat\": \"md\"\n}", "parity.json:2:3: error E-CONFIG: unknown key 'fromat' (did you mean 'formats'?)")]
    [InlineData("{\"tolerance\": {\"absolut\": 1}}", "parity.json:1:16: error E-CONFIG: unknown key 'absolut' in tolerance (did you mean 'absolute'?)")]
    [InlineData("{\"expect\": [{\"kind\": \"type\", \"form\": \"object\"}]}", "parity.json:1:30: error E-CONFIG: unknown key 'form' in an expect rule (did you mean 'from'?)")]
    [InlineData("{\"modes\": \"legacy\"}", "parity.json:1:11: error E-CONFIG: 'modes' needs at least two modes")]
    [InlineData("{\"modes\": [\"legacy\", \"modren\"]}", "parity.json:1:11: error E-CONFIG: 'modren' is not a mode")]
    [InlineData("{\"formats\": [\"md\", \"pdf\"]}", "parity.json:1:20: error E-CONFIG: unknown report format 'pdf'")]
    [InlineData("{\"max_md_chars\": 12.5}", "parity.json:1:18: error E-CONFIG: 'max_md_chars' must be a whole number")]
    [InlineData("{\"max_diff_rows\": -1}", "parity.json:1:19: error E-CONFIG: 'max_diff_rows' must be 0 or more")]
    [InlineData("{\"row_limit\": \"many\"}", "parity.json:1:15: error E-CONFIG: 'row_limit' must be a whole number, not a string")]
    [InlineData("{\"tolerance\": {\"absolute\": -0.5}}", "parity.json:1:28: error E-CONFIG: 'tolerance.absolute' must be a number of 0 or more")]
    [InlineData("{\"expect\": [{}]}", "parity.json:1:13: error E-CONFIG: an expect rule needs at least one of")]
    [InlineData("{\"expect\": [{\"kind\": \"types\"}]}", "parity.json:1:22: error E-CONFIG: unknown finding kind 'types' (did you mean 'type'?)")]
    [InlineData("{\"expect\": [{\"kind\": \"type\", \"to\": \"UTF8\"}]}", "parity.json:1:36: error E-CONFIG: 'to': 'UTF8' is not a type label or missing marker (did you mean 'utf8'?)")]
    [InlineData("{\"expect\": [{\"kind\": \"alias\", \"from\": \"NaN\"}]}", "parity.json:1:13: error E-CONFIG: 'from' and 'to' describe type and missing findings only")]
    [InlineData("{\"golden\": \"a\", \"golden\": \"b\"}", "parity.json:1:17: error E-CONFIG: key 'golden' is given twice")]
    [InlineData("[]", "parity.json:1:1: error E-CONFIG: the project file must be one JSON object, not a list")]
    [InlineData("", "parity.json:1:1: error E-CONFIG: the file is empty")]
    [InlineData("{\"out\": \"x\"} {}", "parity.json:1:14: error E-CONFIG: not valid JSON")]
    public void A_mistake_is_located_in_the_file(string json, string expected)
    {
        Assert.StartsWith(expected, Error(json), StringComparison.Ordinal);
    }

    [Fact]
    public void Broken_json_is_located_at_the_line_of_the_break()
    {
        // Common practice, no source: the line of the unexpected character, 1-based.
        var message = Error("{\n  \"golden\": \"g\",\n  \"out\" \"o\"\n}");
        Assert.StartsWith("parity.json:3:", message, StringComparison.Ordinal);
        Assert.Contains("error E-CONFIG: not valid JSON", message, StringComparison.Ordinal);
        Assert.DoesNotContain("\n", message, StringComparison.Ordinal);
    }

    [Fact]
    public void Columns_count_characters_not_bytes()
    {
        // Unicode: "é" is two UTF-8 bytes but one scalar value; the key after it starts at character 32 (byte 33).
        Assert.StartsWith("parity.json:1:32: error E-CONFIG: unknown key 'x' in tolerance.columns",
            Error("{\"tolerance\":{\"columns\":{\"é*\":{\"x\":1}}}}"), StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_file_is_bad_input_naming_the_file()
    {
        var e = Assert.Throws<EngineException>(() => ProjectFileReader.Read(Path.Combine(Base, "nope", "parity.json"), "nope/parity.json"));
        Assert.Equal("nope/parity.json: error E-FILE-NOT-FOUND: no such project file", e.Format());
    }
}
