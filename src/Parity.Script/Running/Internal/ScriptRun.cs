using System.Globalization;
using Parity.Engine.Errors;
using Parity.Engine.Files;
using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Running.Internal;

/// <summary>
/// One run of one script in one mode: the named frames, the statements in order, and what they record.
/// Every failure becomes a <see cref="ScriptException"/> at the offending node and stops the run.
/// </summary>
internal sealed partial class ScriptRun
{
    private readonly ScriptNode _script;
    private readonly Mode _mode;
    private readonly string _directory;
    private readonly RunOptions _options;
    private readonly ModeRun _run;
    private readonly Dictionary<string, NamedFrame> _frames = new(StringComparer.Ordinal);
    private readonly HashSet<string> _labels = new(StringComparer.Ordinal);
    private readonly List<string>[] _lastMentions;
    private readonly HashSet<string> _unused = new(StringComparer.Ordinal);
    private readonly HashSet<string> _released = new(StringComparer.Ordinal);

    public ScriptRun(ScriptNode script, Mode mode, string directory, RunOptions options, IReadOnlyDictionary<string, Table>? preloaded)
    {
        _script = script;
        _mode = mode;
        _directory = directory;
        _options = options;
        _run = new ModeRun(mode, script.File) { Statements = script.Statements };
        _lastMentions = FrameLifetimes.LastMentions(script.Statements);
        if (preloaded is not null)
            foreach (var (name, table) in preloaded)
                _frames[name] = new NamedFrame(name, Frame.FromTable(table), false);
    }

    public ModeRun Execute()
    {
        for (var index = 0; index < _script.Statements.Count; index++)
        {
            var statement = _script.Statements[index];
            try
            {
                Execute(statement);
                Release(index);
            }
            catch (ScriptException e)
            {
                _run.Failure = e.Diagnostic;
                break;
            }
            catch (EngineException e)
            {
                _run.Failure = Diag(e.Code, e.Message, statement.Span);
                break;
            }
            catch (Exception e) when (e is not OutOfMemoryException)
            {
                // A bug must not crash the other modes: report it where it happened.
                _run.Failure = Diag(ErrorCodes.Internal, "internal error: " + e.Message, statement.Span);
                break;
            }
        }
        return _run;
    }

    /// <summary>
    /// Lets go of the frames that no later statement mentions. Nothing a run records can depend on them
    /// any more, with one exception: under <c>alias</c> a frame that shares a slot with a frame still in use
    /// (a view, or the parent of one) is reached by writes into that frame and listed in their aliasing sets,
    /// so it stays until no frame shares its slots.
    /// </summary>
    private void Release(int index)
    {
        foreach (var name in _lastMentions[index]) _unused.Add(name);
        if (_unused.Count == 0) return;
        bool dropped;
        do
        {
            dropped = false;
            foreach (var name in _unused)
            {
                if (_frames.TryGetValue(name, out var frame) && SharesSlots(name, frame.Frame)) continue;
                _frames.Remove(name);
                _released.Add(name);
                _unused.Remove(name);
                dropped = true;
                break;
            }
        }
        while (dropped && _unused.Count > 0);
    }

    private bool SharesSlots(string name, Frame frame)
    {
        foreach (var (other, f) in _frames)
        {
            if (string.Equals(other, name, StringComparison.Ordinal)) continue;
            foreach (var a in f.Frame.Columns)
                foreach (var b in frame.Columns)
                    if (ReferenceEquals(a.Slot, b.Slot)) return true;
        }
        return false;
    }

    private void Execute(Statement statement)
    {
        switch (statement)
        {
            case LoadStatement load: Load(load); break;
            case LetStatement let: Let(let); break;
            case SetStatement set: Set(set); break;
            case CheckStatement check: Check(check); break;
            default: throw Error(ErrorCodes.Internal, "unknown statement", statement.Span);
        }
    }

    private void Load(LoadStatement load)
    {
        var full = ResolvePath(load);
        var options = new LoadOptions { DisplayPath = ShownPath(full), Root = _options.AllowOutsideRoot ? null : RootFolder(), Format = load.Format?.Name.ToLowerInvariant(), KeepParsed = _options.KeepParsedSources };
        foreach (var o in load.Options)
        {
            switch (o.Key.Name.ToLowerInvariant())
            {
                case "missing":
                {
                    var tokens = new List<string>();
                    foreach (var v in o.Values)
                    {
                        if (v.Value.Kind != Engine.Values.ValueKind.String) throw Error(ErrorCodes.BadOption, "missing tokens must be strings", v.Span);
                        tokens.Add(v.Value.String);
                    }
                    options = options with { MissingTokens = tokens };
                    break;
                }
                case "delimiter":
                {
                    if (o.Values.Count != 1 || o.Values[0].Value.Kind != Engine.Values.ValueKind.String || o.Values[0].Value.String.Length != 1)
                        throw Error(ErrorCodes.BadOption, "delimiter must be one character, e.g. delimiter = ';'", o.Span);
                    options = options with { Delimiter = o.Values[0].Value.String[0] };
                    break;
                }
                default:
                    throw Error(ErrorCodes.BadOption, $"unknown load option '{o.Key.Name}'" + NameSuggester.DidYouMean(o.Key.Name, ["missing", "delimiter"]), o.Key.Span);
            }
        }
        Table table;
        try
        {
            table = _options.TableSource?.Invoke(full, options, _mode) ?? DataLoader.Load(full, options, _mode);
        }
        catch (EngineException e)
        {
            // Loaders name file, row and column themselves; keep their text, point at the path in the script and
            // name the data file as resolved, so a path relative to the script is never a puzzle.
            var file = e.File ?? options.DisplayPath;
            var where = e.Row > 0 ? $" (data file {file}:{e.Row.ToString(CultureInfo.InvariantCulture)}" + (e.ColumnNumber > 0 ? ":" + e.ColumnNumber.ToString(CultureInfo.InvariantCulture) : "") + ")" : $" (data file {file})";
            throw Error(e.Code, e.Message + where, load.PathSpan);
        }
        _frames[load.Name.Name] = new NamedFrame(load.Name.Name, Frame.FromTable(table), false);
    }

    /// <summary>A data file as messages name it: relative to the project root when inside it, else the full path; forward slashes.</summary>
    private string ShownPath(string full)
    {
        var root = Path.GetFullPath(_options.Root ?? Directory.GetCurrentDirectory());
        var relative = Path.GetRelativePath(root, full);
        var shown = relative.StartsWith("..", StringComparison.Ordinal) || Path.IsPathRooted(relative) ? full : relative;
        shown = shown.Replace('\\', '/');
        // A file name may hold control characters; a message must never carry them to a terminal.
        var sb = new System.Text.StringBuilder(shown.Length);
        foreach (var c in shown)
        {
            if (c < ' ' || c is >= '\u007f' and <= '\u009f') sb.Append("\\u{").Append(((int)c).ToString("X", CultureInfo.InvariantCulture)).Append('}');
            else sb.Append(c);
        }
        return sb.ToString();
    }

    private string ResolvePath(LoadStatement load)
    {
        string full;
        try
        {
            if (load.Path.Contains('\0', StringComparison.Ordinal)) throw new ArgumentException("the path holds a NUL character");
            // Combined, not folded: "link/../x" must be resolved physically (docs/reliability.md, "Paths").
            full = Path.Combine(_directory, load.Path);
            if (!Path.IsPathFullyQualified(full)) full = Path.Combine(Directory.GetCurrentDirectory(), full);
        }
        catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
        {
            throw Error(ErrorCodes.FileRead, $"'{load.Path}' is not a valid path: {e.Message}", load.PathSpan);
        }
        string real;
        try
        {
            real = PhysicalPath.Resolve(full);
        }
        catch (EngineException e)
        {
            throw Error(e.Code, $"path '{load.Path}': {e.Message}", load.PathSpan);
        }
        // The path as written goes to the loader (its extension names the format); the loader resolves it again
        // and checks the opened handle against the root.
        if (_options.AllowOutsideRoot) return full;
        var root = Path.GetFullPath(_options.Root ?? Directory.GetCurrentDirectory());
        var realRoot = PhysicalPath.Resolve(Path.TrimEndingDirectorySeparator(root));
        if (!PhysicalPath.IsInside(real, realRoot))
        {
            var lexical = Path.GetFullPath(full);
            var via = string.Equals(real, lexical, StringComparison.Ordinal) ? "" : $" (through a symbolic link to '{real}')";
            throw Error(ErrorCodes.PathOutsideRoot, $"path '{load.Path}' resolves to '{lexical}'{via}, outside the project root '{root}'; "
                + "pass --root DIR to widen the root or --allow-outside-root to allow it", load.PathSpan);
        }
        return full;
    }

    private string RootFolder() => Path.GetFullPath(_options.Root ?? Directory.GetCurrentDirectory());

    private void Let(LetStatement let)
    {
        var (frame, copied) = Derive(let.Value);
        _frames[let.Name.Name] = new NamedFrame(let.Name.Name, frame, copied);
    }

    private void Check(CheckStatement check)
    {
        var named = Named(check.Frame);
        var label = check.EffectiveLabel;
        if (!_labels.Add(label))
            throw Error(ErrorCodes.DupCheckpoint, $"two checkpoints are labelled '{label}'", check.Span);
        var table = named.Frame.Snapshot();
        var keys = new string[check.Keys.Count];
        for (var i = 0; i < keys.Length; i++)
        {
            var key = check.Keys[i];
            if (table.IndexOf(key.Name) < 0)
                throw Error(ErrorCodes.UnknownColumn, $"frame '{named.Name}' has no column '{key.Name}' to use as a key" + NameSuggester.DidYouMean(key.Name, table.Names), key.Span);
            keys[i] = key.Name;
        }
        _run.Checkpoints.Add(new CheckpointResult(label, named.Name, check.Span.LineNumber, check.Span.ColumnNumber, table) { Keys = keys });
    }

    private NamedFrame Named(Identifier id)
    {
        if (_frames.TryGetValue(id.Name, out var f)) return f;
        throw Error(ErrorCodes.UnknownFrame, $"no frame named '{id.Name}'" + NameSuggester.DidYouMean(id.Name, _frames.Keys.Concat(_released)), id.Span);
    }

    private Diagnostic Diag(string code, string message, SourceSpan span) => new(code, message, _script.File, span);

    private ScriptException Error(string code, string message, SourceSpan span) => new(Diag(code, message, span));

    private ScriptException Error(EngineException e, SourceSpan span) => new(Diag(e.Code, e.Message, span));
}
