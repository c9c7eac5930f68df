using System.Diagnostics.CodeAnalysis;
using Parity.Engine.Errors;
using Parity.Script.Diagnostics;

namespace Parity.Harness.Gate;

/// <summary>The one text form of problems a front end reports: <c>file:line:col: error CODE: message</c>.</summary>
public static class GateMessages
{
    /// <summary>A usage mistake (an option or set-up), reported before any work.</summary>
    public static string Usage(string message) => "parity: error " + ErrorCodes.Usage + ": " + message;

    /// <summary>An input file that cannot be read.</summary>
    public static string FileRead(string message) => "parity: error " + ErrorCodes.FileRead + ": " + message;

    /// <summary>
    /// The located message of a bad-input exception of the engine or the interpreter; false for any other
    /// exception (a programming error, which must not be dressed up as bad input).
    /// </summary>
    public static bool TryFormat(Exception exception, [NotNullWhen(true)] out string? message)
    {
        message = exception switch
        {
            EngineException e => e.Format(),
            ScriptException e => e.Diagnostic.Format(),
            _ => null,
        };
        return message is not null;
    }
}
