using System.Globalization;
using Parity.Engine.Errors;
using Parity.Engine.Values;
using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Checking;

/// <summary>
/// Static checks after parsing, in statement order: frames defined before use (E-UNKNOWN-FRAME), aggregates
/// only in <c>compute</c> (E-AGG-PLACE), known functions (E-UNKNOWN-FUNCTION) with the right number of
/// arguments (E-ARG-COUNT), unique checkpoint labels (E-DUP-CHECKPOINT, spec §2.3), load formats and options
/// (E-OPTION) and repeated output columns within one clause (E-DUP-COLUMN). Column names are not checked here:
/// they depend on the data, so the interpreter reports E-UNKNOWN-COLUMN.
/// </summary>
internal sealed class ScriptChecker
{
    private static readonly string[] Formats = ["csv", "parquet", "arrow"];
    private static readonly string[] OptionKeys = ["missing", "delimiter"];

    private readonly string _file;
    private readonly List<Diagnostic> _diagnostics;
    private readonly Dictionary<string, int> _defined = new(StringComparer.Ordinal);
    private readonly Dictionary<string, int> _definedLater = new(StringComparer.Ordinal);
    private readonly Dictionary<string, CheckStatement> _labels = new(StringComparer.Ordinal);
    private Statement? _statement;

    private ScriptChecker(string file, List<Diagnostic> diagnostics)
    {
        _file = file;
        _diagnostics = diagnostics;
    }

    /// <summary>
    /// Appends the static errors of <paramref name="script"/> to <paramref name="diagnostics"/>. Frames named in
    /// <paramref name="assumedFrames"/> (defined by statements that had a syntax error) count as defined, so one
    /// broken <c>load</c> is one error, not one per later use.
    /// </summary>
    public static void Check(ScriptNode script, List<Diagnostic> diagnostics, IReadOnlySet<string>? assumedFrames = null)
    {
        var checker = new ScriptChecker(script.File, diagnostics);
        if (assumedFrames is not null)
            foreach (var name in assumedFrames) checker._defined.TryAdd(name, 0);
        foreach (var statement in script.Statements)
        {
            var name = statement switch
            {
                LoadStatement load => load.Name,
                LetStatement let => let.Name,
                _ => null,
            };
            if (name is not null) checker._definedLater.TryAdd(name.Name, name.Span.LineNumber);
        }
        foreach (var statement in script.Statements) checker.CheckStatement(statement);
    }

    private void CheckStatement(Statement statement)
    {
        _statement = statement;
        switch (statement)
        {
            case LoadStatement load:
                CheckLoad(load);
                Define(load.Name);
                break;
            case LetStatement let:
                CheckDerivation(let.Value);
                Define(let.Name);
                break;
            case SetStatement set:
                if (set.Chain is not null) CheckDerivation(set.Chain);
                else if (set.Frame is not null) CheckFrame(set.Frame);
                CheckExpr(set.Value, "set");
                if (set.Condition is not null) CheckExpr(set.Condition, "where");
                break;
            case CheckStatement check:
                CheckFrame(check.Frame);
                var keyNames = new HashSet<string>(StringComparer.Ordinal);
                foreach (var key in check.Keys)
                    if (!keyNames.Add(key.Name)) Report(ErrorCodes.DupColumn, key.Span, "key column '" + key.Name + "' is named twice");
                var label = check.EffectiveLabel;
                if (_labels.TryGetValue(label, out var first))
                {
                    Report(ErrorCodes.DupCheckpoint, check.Span, "checkpoint label '" + label + "' is already used on line "
                        + first.Span.LineNumber.ToString(CultureInfo.InvariantCulture) + "; give this checkpoint its own label with 'as'");
                }
                else
                {
                    _labels.Add(label, check);
                }
                break;
        }
    }

    private void Define(Identifier name) => _defined.TryAdd(name.Name, name.Span.LineNumber);

    /// <summary>A frame must be defined by an earlier load or let; a later definition is named in the message.</summary>
    private void CheckFrame(Identifier frame)
    {
        if (_defined.ContainsKey(frame.Name)) return;
        string message;
        if (_definedLater.TryGetValue(frame.Name, out var line))
        {
            message = line == _statement?.Span.LineNumber
                ? "frame '" + frame.Name + "' is used in its own definition before it exists"
                : "frame '" + frame.Name + "' is used before it is defined on line " + line.ToString(CultureInfo.InvariantCulture);
        }
        else
        {
            message = "unknown frame '" + frame.Name + "'";
            var candidates = new List<string>(_defined.Keys);
            candidates.AddRange(_definedLater.Keys);
            var suggestion = NameSuggester.Suggest(frame.Name, candidates);
            if (suggestion is not null)
            {
                message += _defined.ContainsKey(suggestion)
                    ? " (did you mean '" + suggestion + "'?)"
                    : " (did you mean '" + suggestion + "'? it is defined later, on line "
                        + _definedLater[suggestion].ToString(CultureInfo.InvariantCulture) + ")";
            }
        }
        Report(ErrorCodes.UnknownFrame, frame.Span, message);
    }

    private void CheckDerivation(Derivation derivation)
    {
        CheckFrame(derivation.Source);
        foreach (var clause in derivation.Clauses)
        {
            switch (clause)
            {
                case WhereClause where:
                    CheckExpr(where.Condition, "where");
                    break;
                case SelectClause select:
                    CheckUnique(select.Columns, "select");
                    break;
                case RenameClause rename:
                    var targets = new List<Identifier>();
                    foreach (var pair in rename.Pairs) targets.Add(pair.To);
                    CheckUnique(targets, "rename");
                    break;
                case AddClause add:
                    var added = new List<Identifier>();
                    foreach (var item in add.Items)
                    {
                        added.Add(item.Name);
                        CheckExpr(item.Value, "add");
                    }
                    CheckUnique(added, "add");
                    break;
                case GroupByClause group:
                    CheckGroup(group);
                    break;
                case JoinClause join:
                    CheckFrame(join.Other);
                    break;
                case AppendClause append:
                    CheckFrame(append.Other);
                    break;
            }
        }
    }

    private void CheckGroup(GroupByClause group)
    {
        var names = new List<Identifier>(group.Keys);
        foreach (var item in group.Computes)
        {
            names.Add(item.Name);
            if (!CheckComputed(item.Value))
            {
                Report(ErrorCodes.AggregatePlace, item.Value.Span, "'compute' needs an aggregate in each column, such as "
                    + item.Name.Name + " = sum(fare) (aggregates: " + string.Join(", ", FunctionCatalog.AggregateNames) + ")");
            }
        }
        CheckUnique(names, "group by ... compute");
    }

    /// <summary>
    /// Walks a <c>compute</c> expression: aggregates may stand anywhere except inside another aggregate's
    /// argument (<c>round(avg(fare), 2)</c> is fine, <c>sum(count())</c> is not). Returns whether it holds one.
    /// </summary>
    private bool CheckComputed(Expr expr)
    {
        switch (expr)
        {
            case BinaryExpr binary:
                return CheckComputed(binary.Left) | CheckComputed(binary.Right);
            case UnaryExpr unary:
                return CheckComputed(unary.Operand);
            case IsNullExpr isNull:
                return CheckComputed(isNull.Operand);
            case CallExpr call when FunctionCatalog.IsAggregate(call.Function.Name):
                CheckArity(call);
                foreach (var arg in call.Args) CheckExpr(arg, "an aggregate's argument");
                return true;
            case CallExpr call:
                if (!FunctionCatalog.IsKnown(call.Function.Name))
                {
                    Report(ErrorCodes.UnknownFunction, call.Function.Span, "unknown function '" + call.Function.Name + "'"
                        + NameSuggester.DidYouMean(call.Function.Name, FunctionCatalog.Names));
                    foreach (var arg in call.Args) CheckComputed(arg);
                    return true; // a misspelt aggregate: one error is enough
                }
                CheckArity(call);
                var any = false;
                foreach (var arg in call.Args) any |= CheckComputed(arg);
                return any;
            default:
                return false;
        }
    }

    /// <summary>Walks an expression outside <c>compute</c>, where every aggregate is misplaced.</summary>
    private void CheckExpr(Expr expr, string place)
    {
        switch (expr)
        {
            case BinaryExpr binary:
                CheckExpr(binary.Left, place);
                CheckExpr(binary.Right, place);
                break;
            case UnaryExpr unary:
                CheckExpr(unary.Operand, place);
                break;
            case IsNullExpr isNull:
                CheckExpr(isNull.Operand, place);
                break;
            case CallExpr call:
                var name = call.Function.Name;
                if (!FunctionCatalog.IsKnown(name))
                {
                    Report(ErrorCodes.UnknownFunction, call.Function.Span, "unknown function '" + name + "'"
                        + NameSuggester.DidYouMean(name, FunctionCatalog.Names));
                }
                else if (FunctionCatalog.IsAggregate(name))
                {
                    Report(ErrorCodes.AggregatePlace, call.Function.Span, "aggregate '" + name + "' is not allowed in "
                        + place + "; aggregates belong in 'group by ... compute'");
                }
                else
                {
                    CheckArity(call);
                }
                foreach (var arg in call.Args) CheckExpr(arg, place);
                break;
        }
    }

    private void CheckArity(CallExpr call)
    {
        FunctionCatalog.TryGetArity(call.Function.Name, out var min, out var max);
        var count = call.Args.Count;
        if (count >= min && count <= max) return;
        string wanted;
        if (max == int.MaxValue) wanted = "at least " + Arguments(min);
        else if (min == max) wanted = Arguments(min);
        else wanted = min.ToString(CultureInfo.InvariantCulture) + " or " + Arguments(max);
        Report(ErrorCodes.ArgCount, call.Function.Span, call.Function.Name + " takes " + wanted + ", got "
            + count.ToString(CultureInfo.InvariantCulture));
    }

    private static string Arguments(int n) =>
        n.ToString(CultureInfo.InvariantCulture) + (n == 1 ? " argument" : " arguments");

    private void CheckUnique(IReadOnlyList<Identifier> names, string clause)
    {
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var name in names)
        {
            if (!seen.Add(name.Name))
                Report(ErrorCodes.DupColumn, name.Span, "column '" + name.Name + "' appears twice in '" + clause + "'");
        }
    }

    private void CheckLoad(LoadStatement load)
    {
        string? format = null;
        if (load.Format is { } given)
        {
            format = Array.Find(Formats, f => f.Equals(given.Name, StringComparison.OrdinalIgnoreCase));
            if (format is null)
            {
                Report(ErrorCodes.BadOption, given.Span, "unknown file format '" + given.Name + "' (expected csv, parquet or arrow)"
                    + NameSuggester.DidYouMean(given.Name, Formats));
            }
        }
        else
        {
            var extension = Path.GetExtension(load.Path);
            if (extension.Equals(".parquet", StringComparison.OrdinalIgnoreCase)) format = "parquet";
            else if (extension.ToLowerInvariant() is ".arrow" or ".arrows" or ".ipc" or ".feather") format = "arrow"; // as DataLoader
        }

        var seen = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        foreach (var option in load.Options)
        {
            var key = option.Key.Name;
            var known = Array.Find(OptionKeys, k => k.Equals(key, StringComparison.OrdinalIgnoreCase));
            if (known is null)
            {
                Report(ErrorCodes.BadOption, option.Key.Span, "unknown load option '" + key + "' (options: missing, delimiter)"
                    + NameSuggester.DidYouMean(key, OptionKeys));
                continue;
            }
            if (!seen.Add(known))
            {
                Report(ErrorCodes.BadOption, option.Key.Span, "load option '" + known + "' is given twice");
                continue;
            }
            if (format is "parquet" or "arrow")
            {
                Report(ErrorCodes.BadOption, option.Key.Span, "load option '" + known + "' applies to csv files only, not " + format);
                continue;
            }
            if (known == "missing") CheckMissingOption(option);
            else CheckDelimiterOption(option);
        }
    }

    private void CheckMissingOption(LoadOption option)
    {
        foreach (var value in option.Values)
        {
            if (value.Value.Kind != ValueKind.String)
            {
                Report(ErrorCodes.BadOption, value.Span, "load option 'missing' takes strings in single quotes, found "
                    + Describe(value.Value));
            }
        }
    }

    private void CheckDelimiterOption(LoadOption option)
    {
        if (option.IsList || option.Values.Count != 1 || option.Values[0].Value.Kind != ValueKind.String)
        {
            Report(ErrorCodes.BadOption, option.IsList ? option.Key.Span : option.Values[0].Span,
                "load option 'delimiter' takes one character in single quotes, such as ';'");
            return;
        }
        var value = option.Values[0];
        var text = value.Value.String;
        if (text.Length != 1 || text[0] is '"' or '\n' or '\r' || char.IsSurrogate(text[0]))
        {
            Report(ErrorCodes.BadOption, value.Span, "load option 'delimiter' must be one character other than a double quote or a line break, found '"
                + text + "'");
        }
    }

    private static string Describe(Value value) => value.Kind switch
    {
        ValueKind.Missing => "null",
        ValueKind.String => "'" + value.String + "'",
        _ => ValueText.Format(value),
    };

    private void Report(string code, SourceSpan span, string message) =>
        _diagnostics.Add(new Diagnostic(code, message, _file, span));
}
