namespace Parity.Script.Parsing;

/// <summary>What a <see cref="Token"/> is. The <c>Bad*</c> kinds carry malformed text the parser reports.</summary>
internal enum TokenKind : byte
{
    /// <summary>A bare word: a keyword or a name (which one is decided by the parser).</summary>
    Word,

    /// <summary>A double-quoted name (<c>"fare usd"</c>); never a keyword.</summary>
    QuotedName,

    Integer,
    Float,

    /// <summary>A single-quoted string literal.</summary>
    String,

    Equal,
    NotEqual,
    Less,
    LessEqual,
    Greater,
    GreaterEqual,
    Plus,
    Minus,
    Star,
    Slash,
    Percent,
    Concat,
    LeftParen,
    RightParen,
    LeftBracket,
    RightBracket,
    Comma,
    Dot,

    /// <summary>The end of a logical line (a statement boundary); continuation lines produce none.</summary>
    Newline,

    EndOfText,

    BadCharacter,
    UnterminatedString,
    UnterminatedName,
    EmptyName,
    BadNumber,
}
