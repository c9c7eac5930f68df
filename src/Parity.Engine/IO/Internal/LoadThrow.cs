using Parity.Engine.Errors;

namespace Parity.Engine.IO.Internal;

/// <summary>All loader failures in one place, so every one carries a code, the file and a 1-based position.</summary>
internal static class LoadThrow
{
    public static EngineException Error(string code, string file, string message, int row = 0, int column = 0) =>
        new(code, message, file, row, column);

    public static EngineException FileNotFound(string file) =>
        new(ErrorCodes.FileNotFound, "no such file", file, 0, 0);

    public static EngineException FileRead(string file, string reason) =>
        new(ErrorCodes.FileRead, "cannot read the file: " + reason, file, 0, 0);

    public static EngineException Format(string file, string reason) =>
        new(ErrorCodes.FileFormat, reason, file, 0, 0);
}
