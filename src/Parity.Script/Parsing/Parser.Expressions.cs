using System.Globalization;
using Parity.Engine.Errors;
using Parity.Engine.Values;
using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Parsing;

/// <summary>
/// Expressions (spec §3.4), loosest first: <c>or</c>; <c>and</c>; <c>not</c>; one comparison or
/// <c>is [not] null</c>; <c>||</c>; <c>+ -</c>; <c>* / %</c>; unary minus; primaries. Binary operators
/// associate to the left; comparisons do not chain (<c>a &lt; b &lt; c</c> is an error).
/// </summary>
internal sealed partial class Parser
{
    private Expr ParseExpression()
    {
        Enter();
        var e = ParseOr();
        _nesting--;
        return e;
    }

    private void Enter()
    {
        if (++_nesting > MaxDepth)
            throw Failure(Current, "expression nested deeper than " + MaxDepth.ToString(CultureInfo.InvariantCulture) + " levels", ErrorCodes.Limit);
    }

    private Expr ParseOr()
    {
        var left = ParseAnd();
        while (IsKeyword(Current, "or"))
        {
            var op = Advance();
            left = Binary(BinaryOp.Or, op, left, ParseAnd());
        }
        return left;
    }

    private Expr ParseAnd()
    {
        var left = ParseNot();
        while (IsKeyword(Current, "and"))
        {
            var op = Advance();
            left = Binary(BinaryOp.And, op, left, ParseNot());
        }
        return left;
    }

    private Expr ParseNot()
    {
        if (!IsKeyword(Current, "not")) return ParseComparison();
        var op = Advance();
        Enter();
        var operand = ParseNot();
        _nesting--;
        return Unary(UnaryOp.Not, op, operand);
    }

    private Expr ParseComparison()
    {
        var left = ParseConcat();
        var compared = false;
        if (ComparisonOp(Current.Kind) is { } cmp)
        {
            var op = Advance();
            left = Binary(cmp, op, left, ParseConcat());
            compared = true;
        }
        else if (IsKeyword(Current, "is"))
        {
            var op = Advance();
            var negated = false;
            if (IsKeyword(Current, "not"))
            {
                Advance();
                negated = true;
            }
            ExpectKeyword("null");
            left = Track(new IsNullExpr(left, negated, SpanFrom(op)), Depth(left) + 1);
            compared = true;
        }
        if (compared && (ComparisonOp(Current.Kind) is not null || IsKeyword(Current, "is")))
        {
            throw Failure(Current, "comparisons do not chain: found " + Describe(Current)
                + " after a comparison; combine comparisons with 'and' or use parentheses");
        }
        return left;
    }

    private static BinaryOp? ComparisonOp(TokenKind kind) => kind switch
    {
        TokenKind.Equal => BinaryOp.Eq,
        TokenKind.NotEqual => BinaryOp.Ne,
        TokenKind.Less => BinaryOp.Lt,
        TokenKind.LessEqual => BinaryOp.Le,
        TokenKind.Greater => BinaryOp.Gt,
        TokenKind.GreaterEqual => BinaryOp.Ge,
        _ => null,
    };

    private Expr ParseConcat()
    {
        var left = ParseAdditive();
        while (Current.Kind == TokenKind.Concat)
        {
            var op = Advance();
            left = Binary(BinaryOp.Concat, op, left, ParseAdditive());
        }
        return left;
    }

    private Expr ParseAdditive()
    {
        var left = ParseMultiplicative();
        while (Current.Kind is TokenKind.Plus or TokenKind.Minus)
        {
            var op = Advance();
            left = Binary(op.Kind == TokenKind.Plus ? BinaryOp.Add : BinaryOp.Sub, op, left, ParseMultiplicative());
        }
        return left;
    }

    private Expr ParseMultiplicative()
    {
        var left = ParseUnary();
        while (Current.Kind is TokenKind.Star or TokenKind.Slash or TokenKind.Percent)
        {
            var op = Advance();
            var kind = op.Kind switch
            {
                TokenKind.Star => BinaryOp.Mul,
                TokenKind.Slash => BinaryOp.Div,
                _ => BinaryOp.Mod,
            };
            left = Binary(kind, op, left, ParseUnary());
        }
        return left;
    }

    private Expr ParseUnary()
    {
        if (Current.Kind != TokenKind.Minus) return ParsePrimary();
        // A minus directly before a number is part of the literal, so -9223372036854775808 and
        // 'fill fare with -1' work; for every other operand it is the negation operator.
        if (PeekToken(1).Kind is TokenKind.Integer or TokenKind.Float) return ParseNumber(negative: true);
        var op = Advance();
        Enter();
        var operand = ParseUnary();
        _nesting--;
        return Unary(UnaryOp.Negate, op, operand);
    }

    private Expr ParsePrimary()
    {
        var token = Current;
        switch (token.Kind)
        {
            case TokenKind.Integer:
            case TokenKind.Float:
                return ParseNumber(negative: false);
            case TokenKind.String:
                Advance();
                return new LiteralExpr(Value.Of(Lexer.Unquote(_text, token)), token.Span);
            case TokenKind.QuotedName:
                Advance();
                return new ColumnExpr(new Identifier(Lexer.Unquote(_text, token), token.Span), token.Span);
            case TokenKind.LeftParen:
            {
                Advance();
                Enter();
                var inner = ParseOr();
                _nesting--;
                Expect(TokenKind.RightParen, "')' or an operator");
                return inner;
            }
            case TokenKind.Word:
            {
                if (TryParseKeywordLiteral(out var literal)) return literal;
                if (Keywords.IsReserved(token.Text(_text))) throw Expected("an expression");
                Advance();
                var name = new Identifier(token.Text(_text).ToString(), token.Span);
                if (Current.Kind != TokenKind.LeftParen) return new ColumnExpr(name, token.Span);
                return ParseCallArguments(name, token);
            }
            default:
                throw Expected("an expression");
        }
    }

    private CallExpr ParseCallArguments(Identifier function, Token start)
    {
        Advance(); // '('
        Enter();
        var args = new List<Expr>();
        var depth = 0;
        if (Current.Kind != TokenKind.RightParen)
        {
            do
            {
                var arg = ParseOr();
                depth = Math.Max(depth, Depth(arg));
                args.Add(arg);
            }
            while (Accept(TokenKind.Comma));
        }
        Expect(TokenKind.RightParen, "',' or ')' after a function argument");
        _nesting--;
        return Track(new CallExpr(function, args, SpanFrom(start)), depth + 1);
    }

    /// <summary><c>true</c>, <c>false</c> or <c>null</c> (any case) at the current token.</summary>
    private bool TryParseKeywordLiteral(out LiteralExpr literal)
    {
        var token = Current;
        Value? value = IsKeyword(token, "true") ? Value.Of(true)
            : IsKeyword(token, "false") ? Value.Of(false)
            : IsKeyword(token, "null") ? Value.Null
            : null;
        literal = null!;
        if (value is null) return false;
        Advance();
        literal = new LiteralExpr(value.Value, token.Span);
        return true;
    }

    /// <summary>A literal as <c>fill</c> and load options take it: a number (optionally negative), string, true, false, null.</summary>
    private LiteralExpr ParseLiteral(string expected, bool allowNull = true)
    {
        var token = Current;
        switch (token.Kind)
        {
            case TokenKind.Integer:
            case TokenKind.Float:
                return ParseNumber(negative: false);
            case TokenKind.Minus when PeekToken(1).Kind is TokenKind.Integer or TokenKind.Float:
                return ParseNumber(negative: true);
            case TokenKind.String:
                Advance();
                return new LiteralExpr(Value.Of(Lexer.Unquote(_text, token)), token.Span);
            case TokenKind.Word when TryParseKeywordLiteral(out var literal):
                if (!allowNull && literal.IsNull)
                {
                    _index--;
                    throw Expected(expected);
                }
                return literal;
            default:
                throw Expected(expected);
        }
    }

    /// <summary>An integer (int64) or float (float64) literal, with the minus sign when <paramref name="negative"/>.</summary>
    private LiteralExpr ParseNumber(bool negative)
    {
        var start = Current;
        if (negative) Advance();
        var token = Advance();
        var digits = token.Text(_text);
        var span = SpanFrom(start);
        if (token.Kind == TokenKind.Integer)
        {
            // Parse with the sign so that the smallest int64 is reachable.
            var text = negative ? "-" + digits.ToString() : digits.ToString();
            if (long.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out var i))
                return new LiteralExpr(Value.Of(i), span);
            throw Failure(start, "integer " + Clip(text) + " is outside the int64 range");
        }
        var d = double.Parse(digits, NumberStyles.Float, CultureInfo.InvariantCulture);
        if (double.IsInfinity(d)) throw Failure(start, "number " + Clip(digits) + " is too large for float64");
        return new LiteralExpr(Value.Of(negative ? -d : d), span);
    }

    private Expr Binary(BinaryOp op, Token opToken, Expr left, Expr right) =>
        Track(new BinaryExpr(op, left, right, opToken.Span), Math.Max(Depth(left), Depth(right)) + 1, opToken);

    private Expr Unary(UnaryOp op, Token opToken, Expr operand) =>
        Track(new UnaryExpr(op, operand, opToken.Span), Depth(operand) + 1, opToken);

    private int Depth(Expr e) => _depths.TryGetValue(e, out var d) ? d : 1;

    /// <summary>Records a node's tree depth; long operator chains are deep trees even without parentheses.</summary>
    private T Track<T>(T e, int depth, Token? at = null)
        where T : Expr
    {
        if (depth > MaxDepth)
            throw Failure(at ?? Current, "expression nested deeper than " + MaxDepth.ToString(CultureInfo.InvariantCulture) + " levels", ErrorCodes.Limit);
        if (depth > 1) _depths[e] = depth;
        return e;
    }
}
