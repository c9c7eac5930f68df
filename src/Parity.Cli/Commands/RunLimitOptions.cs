using System.CommandLine;
using System.Globalization;
using Parity.Harness.Formatting;
using Parity.Harness.Gate;

namespace Parity.Cli.Commands;

/// <summary>
/// The interpreter's safety settings, shared by every command that runs scripts: <c>--max-rows</c>,
/// <c>--max-string-bytes</c>, <c>--root</c> and <c>--allow-outside-root</c> (docs/reliability.md).
/// </summary>
internal sealed class RunLimitOptions
{
    private static readonly GateOptions Defaults = new() { WorkingDirectory = "." };

    private readonly Option<long?> _maxRows = new("--max-rows")
    {
        Description = "Most rows a join or append may produce before the run stops with E-LIMIT (default "
            + Defaults.MaxRows.ToString(CultureInfo.InvariantCulture) + ").",
    };

    private readonly Option<long?> _maxStringBytes = new("--max-string-bytes")
    {
        Description = "Most UTF-8 bytes one computed string may have before the run stops with E-LIMIT (default "
            + Defaults.MaxStringBytes.ToString(CultureInfo.InvariantCulture) + ").",
    };

    private readonly Option<string> _root = new("--root")
    {
        Description = "Project root: load paths may not leave it (default: the current directory).",
    };

    private readonly Option<bool> _allowOutsideRoot = new("--allow-outside-root")
    {
        Description = "Let load paths leave the project root.",
    };

    public void AddTo(Command command)
    {
        command.Options.Add(_maxRows);
        command.Options.Add(_maxStringBytes);
        command.Options.Add(_root);
        command.Options.Add(_allowOutsideRoot);
    }

    /// <summary>True when the command line gives <c>--max-rows</c> (it then overrides the project file).</summary>
    public bool GivesMaxRows(ParseResult parse) => parse.GetValue(_maxRows) is not null;

    /// <summary>True when the command line gives <c>--max-string-bytes</c>.</summary>
    public bool GivesMaxStringBytes(ParseResult parse) => parse.GetValue(_maxStringBytes) is not null;

    /// <summary>
    /// Gate options for the working directory with the limits the command line asks for, or false after a
    /// usage message on stderr.
    /// </summary>
    public bool TryGet(ParseResult parse, CliContext context, out GateOptions options)
    {
        options = new GateOptions { WorkingDirectory = context.WorkingDirectory };
        var maxRows = parse.GetValue(_maxRows);
        var maxBytes = parse.GetValue(_maxStringBytes);
        if (maxRows is < 1 || maxBytes is < 1)
        {
            context.Error.WriteLine(GateMessages.Usage((maxRows is < 1 ? "--max-rows" : "--max-string-bytes") + " must be 1 or more"));
            return false;
        }
        var root = parse.GetValue(_root);
        var fullRoot = context.WorkingDirectory;
        if (root is not null)
        {
            try
            {
                fullRoot = Path.GetFullPath(root, context.WorkingDirectory);
            }
            catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
            {
                context.Error.WriteLine(GateMessages.Usage("--root: " + e.Message));
                return false;
            }
            if (!Directory.Exists(fullRoot))
            {
                context.Error.WriteLine(GateMessages.Usage("--root: no such folder '" + CellText.Safe(root) + "'"));
                return false;
            }
        }
        options = options with
        {
            MaxRows = maxRows ?? Defaults.MaxRows,
            MaxStringBytes = maxBytes ?? Defaults.MaxStringBytes,
            Root = fullRoot,
            AllowOutsideRoot = parse.GetValue(_allowOutsideRoot),
        };
        return true;
    }
}
