using System.Globalization;
using Parity.Engine.Errors;
using Parity.Engine.Modes;
using Parity.Harness.Findings;
using Parity.Harness.Formatting;
using Parity.Harness.Project.Internal;
using Parity.Harness.Reports;

namespace Parity.Harness.Project;

/// <summary>
/// Reads <c>parity.json</c> (docs/workflow.md, "Project file"): JSON with comments. An unknown key, a value
/// of the wrong type or out of range is bad input, thrown as an <see cref="EngineException"/> with code
/// <c>E-CONFIG</c> located at the key or value (<c>parity.json:7:15: error E-CONFIG: ...</c>).
/// </summary>
public static class ProjectFileReader
{
    /// <summary>The file looked for in the working directory when no <c>--config</c> is given.</summary>
    public const string DefaultName = "parity.json";

    /// <summary>The largest project file read (a settings file, not data).</summary>
    public const int MaxBytes = 1 << 20;

    private static readonly string[] TopKeys =
        ["scripts", "modes", "golden", "out", "formats", "tolerance", "row_limit", "max_rows", "max_string_bytes", "max_diff_rows", "max_md_chars", "expect"];

    private static readonly string[] ToleranceKeys = ["absolute", "relative", "columns"];

    private static readonly string[] ColumnToleranceKeys = ["absolute", "relative"];

    private static readonly string[] RuleKeys = ["kind", "script", "checkpoint", "columns", "from", "to", "note"];

    /// <summary>Reads and checks the file at <paramref name="fullPath"/>; <paramref name="display"/> names it in messages.</summary>
    public static ProjectFile Read(string fullPath, string display)
    {
        byte[] bytes;
        try
        {
            var info = new FileInfo(fullPath);
            if (!info.Exists) throw new EngineException(ErrorCodes.FileNotFound, "no such project file", display, 0, 0);
            if (info.Length > MaxBytes)
                throw new EngineException(ErrorCodes.Config, "the project file is larger than " + MaxBytes.ToString(CultureInfo.InvariantCulture) + " bytes", display, 0, 0);
            bytes = File.ReadAllBytes(fullPath);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new EngineException(ErrorCodes.FileRead, e.Message, display, 0, 0);
        }
        var baseDir = Path.GetDirectoryName(fullPath) ?? Directory.GetCurrentDirectory();
        return Parse(bytes, display, baseDir);
    }

    /// <summary>Parses project-file text; relative paths in it are resolved against <paramref name="baseDirectory"/>.</summary>
    public static ProjectFile Parse(byte[] bytes, string display, string baseDirectory)
    {
        var root = ConfigJson.Parse(bytes, display);
        if (root.Kind != ConfigNodeKind.Object) throw Bad(display, root, "the project file must be one JSON object, not " + root.KindName);
        var file = new ProjectFile { Display = display };
        foreach (var (name, line, col, value) in root.Members)
        {
            switch (name)
            {
                case "scripts":
                    file = file with { Scripts = Paths(display, value, baseDirectory, "scripts") };
                    break;
                case "modes":
                    file = file with { Modes = Modes(display, value) };
                    break;
                case "golden":
                    file = file with { Golden = Path.GetFullPath(NonEmptyString(display, value, "golden"), baseDirectory) };
                    break;
                case "out":
                    file = file with { Out = Path.GetFullPath(NonEmptyString(display, value, "out"), baseDirectory) };
                    break;
                case "formats":
                    file = file with { Formats = Formats(display, value) };
                    break;
                case "tolerance":
                    file = Tolerance(display, value, file);
                    break;
                case "row_limit":
                    file = file with { RowLimit = (int)Count(display, value, name, 0, int.MaxValue) };
                    break;
                case "max_rows":
                    file = file with { MaxRows = Count(display, value, name, 1, long.MaxValue) };
                    break;
                case "max_string_bytes":
                    file = file with { MaxStringBytes = Count(display, value, name, 1, long.MaxValue) };
                    break;
                case "max_diff_rows":
                    file = file with { MaxDiffRows = (int)Count(display, value, name, 0, int.MaxValue) };
                    break;
                case "max_md_chars":
                    file = file with { MaxMarkdownChars = (int)Count(display, value, name, 1000, int.MaxValue) };
                    break;
                case "expect":
                    file = file with { Expect = Rules(display, value) };
                    break;
                default:
                    throw UnknownKey(display, line, col, name, TopKeys, "");
            }
        }
        return file;
    }

    private static EngineException Bad(string display, ConfigNode node, string message) =>
        ConfigJson.Fail(display, node.Line, node.Column, message);

    private static EngineException UnknownKey(string display, int line, int col, string name, string[] valid, string where)
    {
        var near = Script.Diagnostics.NameSuggester.Suggest(name, valid);
        return ConfigJson.Fail(display, line, col, "unknown key '" + CellText.Safe(name) + "'" + where
            + (near is null ? "" : " (did you mean '" + near + "'?)") + "; valid: " + string.Join(", ", valid));
    }

    private static string NonEmptyString(string display, ConfigNode node, string key)
    {
        if (node.Kind != ConfigNodeKind.String) throw Bad(display, node, "'" + key + "' must be a string, not " + node.KindName);
        if (string.IsNullOrWhiteSpace(node.Text)) throw Bad(display, node, "'" + key + "' must not be empty");
        if (node.Text.Contains('\0', StringComparison.Ordinal)) throw Bad(display, node, "'" + key + "' must not contain a NUL character");
        return node.Text;
    }

    private static List<string> StringList(string display, ConfigNode node, string key)
    {
        if (node.Kind == ConfigNodeKind.String) return [NonEmptyString(display, node, key)];
        if (node.Kind != ConfigNodeKind.Array) throw Bad(display, node, "'" + key + "' must be a list of strings, not " + node.KindName);
        if (node.Items.Count == 0) throw Bad(display, node, "'" + key + "' must not be an empty list");
        var list = new List<string>(node.Items.Count);
        foreach (var item in node.Items) list.Add(NonEmptyString(display, item, key));
        return list;
    }

    private static List<string> Paths(string display, ConfigNode node, string baseDirectory, string key)
    {
        var list = StringList(display, node, key);
        for (var i = 0; i < list.Count; i++)
            list[i] = Path.GetFullPath(list[i], baseDirectory).Replace('\\', '/');
        return list;
    }

    private static string Modes(string display, ConfigNode node)
    {
        var text = string.Join(",", StringList(display, node, "modes"));
        if (!Mode.TryParseList(text, out var modes, out var bad))
            throw Bad(display, node, "'" + CellText.Safe(bad ?? "") + "' is not a mode; valid: all, " + Mode.ValidSpellings);
        if (modes.Count < 2) throw Bad(display, node, "'modes' needs at least two modes to compare (e.g. [\"legacy\", \"modern\"])");
        return text;
    }

    private static List<string> Formats(string display, ConfigNode node)
    {
        var list = StringList(display, node, "formats");
        var shown = node.Kind == ConfigNodeKind.Array ? node.Items : [node];
        for (var i = 0; i < list.Count; i++)
        {
            var name = list[i].Trim().ToLowerInvariant();
            if (!ReportWriters.Formats.Contains(name))
                throw Bad(display, shown[i], "unknown report format '" + CellText.Safe(list[i]) + "'; valid: " + string.Join(", ", ReportWriters.Formats));
            list[i] = name;
        }
        return list;
    }

    private static long Count(string display, ConfigNode node, string key, long min, long max)
    {
        if (node.Kind != ConfigNodeKind.Number) throw Bad(display, node, "'" + key + "' must be a whole number, not " + node.KindName);
        if (!long.TryParse(node.RawNumber, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out var n))
            throw Bad(display, node, "'" + key + "' must be a whole number, not " + CellText.Safe(node.RawNumber ?? ""));
        if (n < min || n > max)
            throw Bad(display, node, "'" + key + "' must be " + min.ToString(CultureInfo.InvariantCulture) + " or more" + (max < long.MaxValue && max != int.MaxValue ? " and at most " + max.ToString(CultureInfo.InvariantCulture) : ""));
        return n;
    }

    private static double Tolerance(string display, ConfigNode node, string key)
    {
        if (node.Kind != ConfigNodeKind.Number || !double.IsFinite(node.Number) || node.Number < 0)
            throw Bad(display, node, "'" + key + "' must be a number of 0 or more");
        return node.Number;
    }

    private static ProjectFile Tolerance(string display, ConfigNode node, ProjectFile file)
    {
        if (node.Kind != ConfigNodeKind.Object) throw Bad(display, node, "'tolerance' must be an object with absolute, relative, columns, not " + node.KindName);
        foreach (var (name, line, col, value) in node.Members)
        {
            switch (name)
            {
                case "absolute":
                    file = file with { AbsoluteTolerance = Tolerance(display, value, "tolerance.absolute") };
                    break;
                case "relative":
                    file = file with { RelativeTolerance = Tolerance(display, value, "tolerance.relative") };
                    break;
                case "columns":
                    if (value.Kind != ConfigNodeKind.Object) throw Bad(display, value, "'tolerance.columns' must map column globs to {absolute, relative}, not " + value.KindName);
                    var list = new List<ColumnTolerance>(value.Members.Count);
                    foreach (var (glob, gl, gc, spec) in value.Members)
                    {
                        if (glob.Length == 0) throw ConfigJson.Fail(display, gl, gc, "a column glob must not be empty");
                        if (spec.Kind != ConfigNodeKind.Object) throw Bad(display, spec, "the tolerance of '" + CellText.Safe(glob) + "' must be an object with absolute, relative");
                        double? abs = null, rel = null;
                        foreach (var (k, kl, kc, v) in spec.Members)
                        {
                            if (k == "absolute") abs = Tolerance(display, v, "absolute");
                            else if (k == "relative") rel = Tolerance(display, v, "relative");
                            else throw UnknownKey(display, kl, kc, k, ColumnToleranceKeys, " in tolerance.columns");
                        }
                        if (abs is null && rel is null) throw Bad(display, spec, "the tolerance of '" + CellText.Safe(glob) + "' needs absolute or relative");
                        list.Add(new ColumnTolerance(glob, abs, rel));
                    }
                    file = file with { ColumnTolerances = list };
                    break;
                default:
                    throw UnknownKey(display, line, col, name, ToleranceKeys, " in tolerance");
            }
        }
        return file;
    }

    private static List<ExpectRule> Rules(string display, ConfigNode node)
    {
        if (node.Kind != ConfigNodeKind.Array) throw Bad(display, node, "'expect' must be a list of rules, not " + node.KindName);
        var rules = new List<ExpectRule>(node.Items.Count);
        foreach (var item in node.Items)
        {
            if (item.Kind != ConfigNodeKind.Object) throw Bad(display, item, "an expect rule must be an object, not " + item.KindName);
            var rule = new ExpectRule
            {
                Location = display + ":" + item.Line.ToString(CultureInfo.InvariantCulture) + ":" + item.Column.ToString(CultureInfo.InvariantCulture),
            };
            foreach (var (name, line, col, value) in item.Members)
            {
                rule = name switch
                {
                    "kind" => rule with { Kind = Kind(display, value) },
                    "script" => rule with { Script = NonEmptyString(display, value, "script") },
                    "checkpoint" => rule with { Checkpoint = NonEmptyString(display, value, "checkpoint") },
                    "columns" => rule with { Columns = StringList(display, value, "columns") },
                    "from" => rule with { From = DifferenceSide(display, value, "from") },
                    "to" => rule with { To = DifferenceSide(display, value, "to") },
                    "note" => rule with { Note = value.Kind == ConfigNodeKind.String ? value.Text : throw Bad(display, value, "'note' must be a string, not " + value.KindName) },
                    _ => throw UnknownKey(display, line, col, name, RuleKeys, " in an expect rule"),
                };
            }
            if (rule.Kind is null && rule.Script is null && rule.Checkpoint is null && rule.Columns is null && rule.From is null && rule.To is null)
                throw Bad(display, item, "an expect rule needs at least one of kind, script, checkpoint, columns, from, to (an empty rule would expect every finding)");
            if ((rule.From is not null || rule.To is not null) && rule.Kind is not (null or FindingKind.Type or FindingKind.Missing))
                throw Bad(display, item, "'from' and 'to' describe type and missing findings only; a " + rule.Kind.ToString()!.ToLowerInvariant() + " finding has none");
            rules.Add(rule);
        }
        return rules;
    }

    /// <summary>The words a difference is made of: type labels of docs/semantics.md and the missing markers.</summary>
    private static readonly string[] DifferenceWords =
        ["int64", "float64", "bool", "timestamp", "utf8", "object", "NaN", "None", "null", "NaT", "'nan'", "value"];

    private static string DifferenceSide(string display, ConfigNode node, string key)
    {
        var text = NonEmptyString(display, node, key);
        if (Array.IndexOf(DifferenceWords, text) >= 0) return text;
        var near = Script.Diagnostics.NameSuggester.Suggest(text, DifferenceWords);
        throw Bad(display, node, "'" + key + "': '" + CellText.Safe(text) + "' is not a type label or missing marker"
            + (near is null ? "" : " (did you mean '" + near + "'?)") + "; valid: " + string.Join(", ", DifferenceWords));
    }

    private static FindingKind Kind(string display, ConfigNode node)
    {
        var text = NonEmptyString(display, node, "kind");
        foreach (var k in Enum.GetValues<FindingKind>())
            if (string.Equals(k.ToString().ToLowerInvariant(), text, StringComparison.Ordinal)) return k;
        var names = new List<string>();
        foreach (var k in Enum.GetValues<FindingKind>()) names.Add(k.ToString().ToLowerInvariant());
        var near = Script.Diagnostics.NameSuggester.Suggest(text, names);
        throw Bad(display, node, "unknown finding kind '" + CellText.Safe(text) + "'" + (near is null ? "" : " (did you mean '" + near + "'?)") + "; valid: " + string.Join(", ", names));
    }
}
