using System.Text;

namespace Parity.Harness.Golden;

/// <summary>
/// File and folder names in the golden store. A name keeps ASCII letters, digits, <c>.</c>, <c>_</c> and
/// <c>-</c>; every other UTF-8 byte is written <c>%XX</c> (upper-case hex), and so is a leading <c>.</c>, so
/// names are portable, never hidden and never <c>..</c>. A script's folder is its path relative to the
/// working directory, forward slashes, without the <c>.parity</c> extension, with each <c>/</c> written as
/// <c>~</c> (which is otherwise encoded, so the mapping is one-to-one): <c>ferry/refunds.parity</c> becomes
/// <c>ferry~refunds</c>.
/// </summary>
public static class GoldenNames
{
    public const string FindingsFile = "findings.txt";
    public const string RunFile = "run.txt";
    public const string FrameSuffix = ".frame.txt";
    public const string ArrowSuffix = ".frame.arrow";
    public const string LockFile = ".lock";

    public static string ScriptFolder(string scriptRelative)
    {
        var path = scriptRelative.Replace('\\', '/');
        if (path.EndsWith(".parity", StringComparison.Ordinal)) path = path[..^".parity".Length];
        var parts = path.Split('/');
        for (var i = 0; i < parts.Length; i++) parts[i] = Encode(parts[i]);
        return string.Join("~", parts);
    }

    /// <summary>
    /// The script path a folder name stands for (the inverse of <see cref="ScriptFolder"/>), or null when the
    /// name is not one <see cref="ScriptFolder"/> writes (a staging folder, a stray folder, bad escapes).
    /// </summary>
    public static string? TryScriptOfFolder(string folder)
    {
        var parts = folder.Split('~');
        var decoded = new string[parts.Length];
        for (var i = 0; i < parts.Length; i++)
        {
            var d = TryDecode(parts[i]);
            if (d is null || !string.Equals(Encode(d), parts[i], StringComparison.Ordinal)) return null;
            decoded[i] = d;
        }
        return string.Join("/", decoded) + ".parity";
    }

    private static string? TryDecode(string part)
    {
        if (part == "%") return "";
        var bytes = new List<byte>(part.Length);
        for (var i = 0; i < part.Length; i++)
        {
            var c = part[i];
            if (c != '%')
            {
                if (c > 0x7F) return null;
                bytes.Add((byte)c);
                continue;
            }
            if (i + 2 >= part.Length || !byte.TryParse(part.AsSpan(i + 1, 2), System.Globalization.NumberStyles.AllowHexSpecifier, System.Globalization.CultureInfo.InvariantCulture, out var b)) return null;
            bytes.Add(b);
            i += 2;
        }
        try
        {
            return new UTF8Encoding(false, throwOnInvalidBytes: true).GetString(bytes.ToArray());
        }
        catch (DecoderFallbackException)
        {
            return null;
        }
    }

    public static string FrameFile(string label) => Encode(label) + FrameSuffix;

    public static string ArrowFile(string label) => Encode(label) + ArrowSuffix;

    public static string Encode(string text)
    {
        var sb = new StringBuilder(text.Length);
        var bytes = Encoding.UTF8.GetBytes(text);
        for (var i = 0; i < bytes.Length; i++)
        {
            var b = bytes[i];
            var keep = b is >= (byte)'a' and <= (byte)'z' or >= (byte)'A' and <= (byte)'Z' or >= (byte)'0' and <= (byte)'9'
                or (byte)'_' or (byte)'-' || (b == (byte)'.' && i > 0);
            if (keep) sb.Append((char)b);
            else sb.Append('%').Append(b.ToString("X2", System.Globalization.CultureInfo.InvariantCulture));
        }
        return sb.Length == 0 ? "%" : sb.ToString();
    }
}
