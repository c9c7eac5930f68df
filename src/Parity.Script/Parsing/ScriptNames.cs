namespace Parity.Script.Parsing;

/// <summary>The names a script's text mentions: every bare word and double-quoted name, keywords included.</summary>
public static class ScriptNames
{
    /// <summary>
    /// A superset of the columns the script names: a column not in it is never referred to by name (it can
    /// still reach a checkpoint through a whole frame, which is why <c>parity shrink</c> tests every removal).
    /// </summary>
    public static IReadOnlySet<string> Mentioned(string text)
    {
        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (var token in Lexer.Tokenize(text))
        {
            if (token.Kind == TokenKind.Word) names.Add(token.Text(text).ToString());
            else if (token.Kind == TokenKind.QuotedName) names.Add(Lexer.Unquote(text, token));
        }
        return names;
    }
}
