using System.Globalization;
using System.Text.Encodings.Web;

namespace Parity.Harness.Reports.Internal;

/// <summary>
/// The string escaping of our standalone JSON documents (<c>show --json</c>, <c>report.json</c>): what RFC
/// 8259 §7 requires (<c>"</c>, <c>\</c>, U+0000–U+001F), plus DEL and the C1 controls (invisible) and
/// U+2028/U+2029 (line terminators in JavaScript), each as <c>\uXXXX</c> or its short form; everything else,
/// including non-ASCII letters and emoji outside the Basic Multilingual Plane, is written as is. The built-in
/// relaxed encoder still escapes every supplementary character, which makes emoji unreadable. Like it, this
/// encoder does not escape <c>&lt;</c>, <c>&gt;</c>, <c>&amp;</c>: its output must not be pasted into HTML.
/// </summary>
internal sealed class ReadableJsonEncoder : JavaScriptEncoder
{
    public static ReadableJsonEncoder Instance { get; } = new();

    // "\uXXXX" for each of two surrogates in the worst case.
    public override int MaxOutputCharactersPerInputCharacter => 12;

    public override bool WillEncode(int unicodeScalar) =>
        unicodeScalar < 0x20 || unicodeScalar == '"' || unicodeScalar == '\\'
        || (unicodeScalar >= 0x7F && unicodeScalar <= 0x9F) || unicodeScalar == 0x2028 || unicodeScalar == 0x2029
        || (unicodeScalar >= 0xD800 && unicodeScalar <= 0xDFFF);

    public override unsafe int FindFirstCharacterToEncode(char* text, int textLength)
    {
        for (var i = 0; i < textLength; i++)
        {
            var c = text[i];
            if (char.IsHighSurrogate(c) && i + 1 < textLength && char.IsLowSurrogate(text[i + 1]))
            {
                i++;
                continue;
            }
            if (WillEncode(c)) return i;
        }
        return -1;
    }

    public override unsafe bool TryEncodeUnicodeScalar(int unicodeScalar, char* buffer, int bufferLength, out int numberOfCharactersWritten)
    {
        numberOfCharactersWritten = 0;
        if (!WillEncode(unicodeScalar))
        {
            if (unicodeScalar < 0x10000)
            {
                if (bufferLength < 1) return false;
                buffer[0] = (char)unicodeScalar;
                numberOfCharactersWritten = 1;
                return true;
            }
            if (bufferLength < 2) return false;
            var s = char.ConvertFromUtf32(unicodeScalar);
            buffer[0] = s[0];
            buffer[1] = s[1];
            numberOfCharactersWritten = 2;
            return true;
        }
        var shortForm = unicodeScalar switch
        {
            '"' => '"',
            '\\' => '\\',
            '\n' => 'n',
            '\r' => 'r',
            '\t' => 't',
            '\b' => 'b',
            '\f' => 'f',
            _ => '\0',
        };
        if (shortForm != '\0')
        {
            if (bufferLength < 2) return false;
            buffer[0] = '\\';
            buffer[1] = shortForm;
            numberOfCharactersWritten = 2;
            return true;
        }
        if (bufferLength < 6) return false;
        var hex = unicodeScalar.ToString("x4", CultureInfo.InvariantCulture);
        buffer[0] = '\\';
        buffer[1] = 'u';
        for (var i = 0; i < 4; i++) buffer[2 + i] = hex[i];
        numberOfCharactersWritten = 6;
        return true;
    }
}
