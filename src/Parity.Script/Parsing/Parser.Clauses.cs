using System.Globalization;
using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Parsing;

/// <summary>Derivations and their clauses (spec §3.2).</summary>
internal sealed partial class Parser
{
    private static readonly string[] CastTypeWords = ["int64", "float64", "bool", "string", "timestamp"];
    private static readonly CastTarget[] CastTargets = [CastTarget.Int64, CastTarget.Float64, CastTarget.Bool, CastTarget.String, CastTarget.Timestamp];

    /// <summary>
    /// <c>SOURCE clause clause ...</c>. Inside <c>set (...)</c> the derivation ends at <c>)</c>, elsewhere at the
    /// end of the line; anything else after a clause is an error that names the clause words.
    /// </summary>
    private Derivation ParseDerivation(bool inParentheses)
    {
        var source = ParseName("a frame name");
        var clauses = new List<Clause>();
        while (Current.Kind == TokenKind.Word && IsClauseWord(Current))
            clauses.Add(ParseClause());

        var atEnd = inParentheses ? Current.Kind == TokenKind.RightParen : AtLineEnd;
        if (!atEnd)
        {
            throw Expected(
                "a clause (" + string.Join(", ", Keywords.ClauseWords) + ") or " + (inParentheses ? "')'" : "end of line"),
                Keywords.ClauseWords);
        }
        var span = clauses.Count == 0 ? source.Span : SpanFrom(source.Span, clauses[^1].Span);
        return new Derivation(source, clauses, span);
    }

    private bool IsClauseWord(Token token)
    {
        foreach (var word in Keywords.ClauseWords)
            if (IsKeyword(token, word)) return true;
        return false;
    }

    private Clause ParseClause()
    {
        var start = Advance();
        var word = start.Text(_text).ToString().ToLowerInvariant();
        switch (word)
        {
            case "where":
                return new WhereClause(ParseExpression(), SpanFrom(start));
            case "take":
                return new TakeClause(ParseRowCount(), SpanFrom(start));
            case "skip":
                return new SkipClause(ParseRowCount(), SpanFrom(start));
            case "column":
                return new ColumnClause(ParseName("a column name"), SpanFrom(start));
            case "select":
                return new SelectClause(ParseNameList(), SpanFrom(start));
            case "rename":
            {
                var pairs = new List<RenamePair>();
                do
                {
                    var from = ParseName("a column name");
                    ExpectKeyword("to");
                    pairs.Add(new RenamePair(from, ParseName("the new column name")));
                }
                while (Accept(TokenKind.Comma));
                return new RenameClause(pairs, SpanFrom(start));
            }
            case "cast":
            {
                var items = new List<CastItem>();
                do
                {
                    var column = ParseName("a column name");
                    ExpectKeyword("to");
                    var typeToken = Current;
                    var target = ParseCastTarget();
                    items.Add(new CastItem(column, target, typeToken.Span));
                }
                while (Accept(TokenKind.Comma));
                return new CastClause(items, SpanFrom(start));
            }
            case "add":
                return new AddClause(ParseNamedExpressions(), SpanFrom(start));
            case "fill":
            {
                var items = new List<NamedExpr>();
                do
                {
                    var column = ParseName("a column name");
                    ExpectKeyword("with");
                    items.Add(new NamedExpr(column, ParseLiteral("a value (a number, a string, true or false)", allowNull: false)));
                }
                while (Accept(TokenKind.Comma));
                return new FillClause(items, SpanFrom(start));
            }
            case "drop":
            {
                ExpectKeyword("missing");
                var columns = IsName(Current) ? ParseNameList() : [];
                return new DropMissingClause(columns, SpanFrom(start));
            }
            case "order":
            {
                ExpectKeyword("by");
                var keys = new List<OrderKey>();
                do
                {
                    var column = ParseName("a column name");
                    var descending = false;
                    if (IsKeyword(Current, "desc"))
                    {
                        Advance();
                        descending = true;
                    }
                    else if (IsKeyword(Current, "asc"))
                    {
                        Advance();
                    }
                    keys.Add(new OrderKey(column, descending));
                }
                while (Accept(TokenKind.Comma));
                return new OrderByClause(keys, SpanFrom(start));
            }
            case "group":
            {
                ExpectKeyword("by");
                var keys = ParseNameList();
                ExpectKeyword("compute");
                var computes = ParseNamedExpressions();
                return new GroupByClause(keys, computes, SpanFrom(start));
            }
            case "join":
            {
                var other = ParseName("a frame name");
                ExpectKeyword("on");
                var leftKey = ParseName("a key column name");
                Identifier? rightKey = null;
                if (Accept(TokenKind.Equal)) rightKey = ParseName("the key column name of the other frame");
                var kind = JoinKind.Inner;
                if (IsKeyword(Current, "left"))
                {
                    Advance();
                    kind = JoinKind.Left;
                }
                else if (IsKeyword(Current, "inner"))
                {
                    Advance();
                }
                return new JoinClause(other, leftKey, rightKey, kind, SpanFrom(start));
            }
            case "append":
                return new AppendClause(ParseName("a frame name"), SpanFrom(start));
            default: // "distinct": the clause words are checked by the caller
            {
                var columns = IsName(Current) ? ParseNameList() : [];
                return new DistinctClause(columns, SpanFrom(start));
            }
        }
    }

    private List<Identifier> ParseNameList()
    {
        var names = new List<Identifier>();
        do
        {
            names.Add(ParseName("a column name"));
        }
        while (Accept(TokenKind.Comma));
        return names;
    }

    /// <summary><c>name = EXPR, ...</c> (the items of <c>add</c> and <c>compute</c>).</summary>
    private List<NamedExpr> ParseNamedExpressions()
    {
        var items = new List<NamedExpr>();
        do
        {
            var name = ParseName("a column name");
            Expect(TokenKind.Equal, "'=' after the column name");
            items.Add(new NamedExpr(name, ParseExpression()));
        }
        while (Accept(TokenKind.Comma));
        return items;
    }

    /// <summary>A whole number of rows for <c>take</c> and <c>skip</c>.</summary>
    private long ParseRowCount()
    {
        var token = Current;
        if (token.Kind != TokenKind.Integer) throw Expected("a whole number of rows (0 or more)");
        if (!long.TryParse(token.Text(_text), NumberStyles.None, CultureInfo.InvariantCulture, out var count))
            throw Failure(token, "row count " + Clip(token.Text(_text)) + " is too large (the largest is " + long.MaxValue.ToString(CultureInfo.InvariantCulture) + ")");
        Advance();
        return count;
    }

    private CastTarget ParseCastTarget()
    {
        var token = Current;
        if (token.Kind == TokenKind.Word)
        {
            var word = token.Text(_text);
            for (var i = 0; i < CastTypeWords.Length; i++)
            {
                if (word.Equals(CastTypeWords[i], StringComparison.OrdinalIgnoreCase))
                {
                    Advance();
                    return CastTargets[i];
                }
            }
        }
        throw Expected("a type (int64, float64, bool, string or timestamp)", CastTypeWords);
    }
}
