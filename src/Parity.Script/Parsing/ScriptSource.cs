using System.Buffers;
using System.Globalization;
using System.Text.Unicode;
using Parity.Engine.Errors;
using Parity.Engine.Files;
using Parity.Script.Diagnostics;

namespace Parity.Script.Parsing;

/// <summary>
/// Reads a script file through the file-access layer (<see cref="SafeFile"/>: a regular file, real path,
/// size cap) and decodes it as strict UTF-8: an invalid sequence is <c>E-UTF8</c> at its line and column,
/// never a silent U+FFFD (docs/language.md, "Files").
/// </summary>
public static class ScriptSource
{
    /// <summary>The largest script read: 16 MiB (scripts are hand-written; this keeps a hostile one from filling memory).</summary>
    public const long MaxBytes = 16L << 20;

    /// <summary>The text of the script at <paramref name="path"/>, shown as <paramref name="display"/> in errors.</summary>
    public static string Read(string path, string display)
    {
        var bytes = SafeFile.ReadAllBytes(path, new FileReadRules
        {
            Display = display,
            MaxBytes = MaxBytes,
            SizeCode = ErrorCodes.Limit,
            SizeHint = "a script may have at most 16 MiB",
        });
        return Decode(bytes, display);
    }

    /// <summary>Strict UTF-8 (a leading byte order mark skipped); throws <see cref="ScriptException"/> <c>E-UTF8</c>, located.</summary>
    public static string Decode(ReadOnlySpan<byte> bytes, string display)
    {
        if (bytes.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF])) bytes = bytes[3..];
        var chars = new char[bytes.Length];
        var status = Utf8.ToUtf16(bytes, chars, out var read, out var written, replaceInvalidSequences: false);
        if (status == OperationStatus.Done) return new string(chars, 0, written);
        // Locate the first bad byte: lines and code point columns of the valid text before it.
        int line = 0, column = 0;
        for (var i = 0; i < written; i++)
        {
            var c = chars[i];
            if (c == '\n') { line++; column = 0; }
            else if (!char.IsLowSurrogate(c)) column++;
        }
        var bad = read < bytes.Length ? bytes[read] : (byte)0;
        var what = read < bytes.Length ? "byte 0x" + bad.ToString("X2", CultureInfo.InvariantCulture) : "a truncated sequence at the end";
        throw new ScriptException(new Diagnostic(ErrorCodes.Utf8,
            "the script is not valid UTF-8 (" + what + " does not start or continue a UTF-8 sequence); save it as UTF-8",
            display, new SourceSpan(written, 0, line, column)));
    }
}
