namespace Parity.Engine.Errors;

/// <summary>
/// A user-facing failure with a stable code (see <see cref="ErrorCodes"/>). The script layer attaches a
/// source position; loaders attach file, row and column. Never used for programming errors.
/// </summary>
public sealed class EngineException : Exception
{
    public EngineException(string code, string message)
        : base(message)
    {
        Code = code;
    }

    public EngineException(string code, string message, string? file, int row, int column)
        : base(message)
    {
        Code = code;
        File = file;
        Row = row;
        ColumnNumber = column;
    }

    public EngineException()
        : this(ErrorCodes.Internal, "internal error")
    {
    }

    public EngineException(string message)
        : this(ErrorCodes.Internal, message)
    {
    }

    public EngineException(string message, Exception inner)
        : base(message, inner)
    {
        Code = ErrorCodes.Internal;
    }

    public string Code { get; }

    /// <summary>The data or script file, where known.</summary>
    public string? File { get; }

    /// <summary>1-based row (data files: the line number of the record) or 0 when unknown.</summary>
    public int Row { get; }

    /// <summary>1-based column (data files: the field number) or 0 when unknown.</summary>
    public int ColumnNumber { get; }

    /// <summary>The canonical text form: <c>file:row:col: error CODE: message</c> (parts omitted when unknown).</summary>
    public string Format()
    {
        // Names and messages carry text from untrusted files: never a raw control character on a terminal.
        var where = File is null ? "parity" : Text.ControlEscape.Escape(File);
        if (Row > 0)
        {
            where += ":" + Row.ToString(System.Globalization.CultureInfo.InvariantCulture);
            if (ColumnNumber > 0) where += ":" + ColumnNumber.ToString(System.Globalization.CultureInfo.InvariantCulture);
        }
        return where + ": error " + Code + ": " + Text.ControlEscape.Escape(Message);
    }
}
