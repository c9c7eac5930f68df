using System.Globalization;
using System.Text;
using Parity.Engine.Values;
using Parity.Script.Parsing;

namespace Parity.Script.Syntax;

/// <summary>
/// A deterministic text form of a syntax tree for golden tests and debugging. One line per statement,
/// clause and item; <c>L:C</c> prefixes and <c>@L:C</c> suffixes are 1-based positions. Expressions are fully
/// parenthesised infix, so precedence is visible: <c>((fare@1:5 *@1:10 2@1:12) +@1:14 1@1:16)</c>. Names are
/// printed bare when they could be written bare, else in double quotes; strings in single quotes with
/// <c>''</c> doubled; floats in shortest round-trip form with a fractional digit.
/// </summary>
public static class SyntaxPrinter
{
    /// <summary>The whole script, one line per statement, clause and item, each ending with <c>\n</c>.</summary>
    public static string Print(ScriptNode script)
    {
        var sb = new StringBuilder();
        foreach (var statement in script.Statements) PrintStatement(sb, statement);
        return sb.ToString();
    }

    /// <summary>One expression on one line.</summary>
    public static string Print(Expr expr)
    {
        var sb = new StringBuilder();
        AppendExpr(sb, expr);
        return sb.ToString();
    }

    /// <summary>A name as it could be written in a script: bare, or in double quotes when it must be.</summary>
    public static string FormatName(string name)
    {
        var bare = name.Length > 0 && !Keywords.IsReserved(name);
        var first = true;
        foreach (var rune in name.EnumerateRunes())
        {
            if (!(first ? Lexer.IsWordStart(rune) : Lexer.IsWordPart(rune)))
            {
                bare = false;
                break;
            }
            first = false;
        }
        return bare ? name : "\"" + name.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
    }

    /// <summary>A string literal as it could be written in a script.</summary>
    public static string FormatString(string text) => "'" + text.Replace("'", "''", StringComparison.Ordinal) + "'";

    private static void PrintStatement(StringBuilder sb, Statement statement)
    {
        sb.Append(statement.Span.ToString()).Append(' ');
        switch (statement)
        {
            case LoadStatement load:
                sb.Append("load ").Append(Name(load.Name)).Append(" from ").Append(FormatString(load.Path))
                    .Append('@').Append(load.PathSpan.ToString());
                if (load.Format is not null) sb.Append(" as ").Append(Name(load.Format));
                sb.Append('\n');
                foreach (var option in load.Options)
                {
                    sb.Append("  ").Append(option.Span.ToString()).Append(" option ").Append(option.Key.Name).Append('@')
                        .Append(option.Key.Span.ToString()).Append(" = ");
                    if (option.IsList) sb.Append('[');
                    for (var i = 0; i < option.Values.Count; i++)
                    {
                        if (i > 0) sb.Append(", ");
                        AppendExpr(sb, option.Values[i]);
                    }
                    if (option.IsList) sb.Append(']');
                    sb.Append('\n');
                }
                break;
            case LetStatement let:
                sb.Append("let ").Append(Name(let.Name)).Append(" = ").Append(Name(let.Value.Source)).Append('\n');
                PrintClauses(sb, let.Value.Clauses, "  ");
                break;
            case SetStatement set:
                sb.Append("set ");
                if (set.Chain is not null) sb.Append('(').Append(Name(set.Chain.Source)).Append(set.Chain.Clauses.Count > 0 ? " ...)" : ")");
                else if (set.Frame is not null) sb.Append(Name(set.Frame));
                sb.Append('.').Append(Name(set.Column)).Append('\n');
                if (set.Chain is not null)
                {
                    sb.Append("  chain\n");
                    PrintClauses(sb, set.Chain.Clauses, "    ");
                }
                sb.Append("  value ");
                AppendExpr(sb, set.Value);
                sb.Append('\n');
                if (set.Condition is not null)
                {
                    sb.Append("  where ");
                    AppendExpr(sb, set.Condition);
                    sb.Append('\n');
                }
                break;
            case CheckStatement check:
                sb.Append("check ").Append(Name(check.Frame));
                for (var i = 0; i < check.Keys.Count; i++) sb.Append(i == 0 ? " key " : ", ").Append(Name(check.Keys[i]));
                if (check.Label is not null) sb.Append(" as ").Append(FormatString(check.Label));
                sb.Append('\n');
                break;
            default:
                sb.Append(statement.GetType().Name).Append('\n');
                break;
        }
    }

    private static void PrintClauses(StringBuilder sb, IReadOnlyList<Clause> clauses, string indent)
    {
        foreach (var clause in clauses)
        {
            sb.Append(indent).Append(clause.Span.ToString()).Append(' ');
            switch (clause)
            {
                case WhereClause where:
                    sb.Append("where ");
                    AppendExpr(sb, where.Condition);
                    break;
                case TakeClause take:
                    sb.Append("take ").Append(take.Count.ToString(CultureInfo.InvariantCulture));
                    break;
                case SkipClause skip:
                    sb.Append("skip ").Append(skip.Count.ToString(CultureInfo.InvariantCulture));
                    break;
                case ColumnClause column:
                    sb.Append("column ").Append(Name(column.Column));
                    break;
                case SelectClause select:
                    sb.Append("select ");
                    AppendNames(sb, select.Columns);
                    break;
                case RenameClause rename:
                    sb.Append("rename ");
                    for (var i = 0; i < rename.Pairs.Count; i++)
                    {
                        if (i > 0) sb.Append(", ");
                        sb.Append(Name(rename.Pairs[i].From)).Append(" to ").Append(Name(rename.Pairs[i].To));
                    }
                    break;
                case CastClause cast:
                    sb.Append("cast ");
                    for (var i = 0; i < cast.Items.Count; i++)
                    {
                        if (i > 0) sb.Append(", ");
                        sb.Append(Name(cast.Items[i].Column)).Append(" to ").Append(CastName(cast.Items[i].Target))
                            .Append('@').Append(cast.Items[i].TargetSpan.ToString());
                    }
                    break;
                case AddClause add:
                    sb.Append("add");
                    AppendItems(sb, add.Items, indent + "  ", " = ");
                    continue;
                case FillClause fill:
                    sb.Append("fill");
                    AppendItems(sb, fill.Items, indent + "  ", " with ");
                    continue;
                case DropMissingClause drop:
                    sb.Append("drop missing");
                    if (drop.Columns.Count > 0) sb.Append(' ');
                    AppendNames(sb, drop.Columns);
                    break;
                case OrderByClause order:
                    sb.Append("order by ");
                    for (var i = 0; i < order.Keys.Count; i++)
                    {
                        if (i > 0) sb.Append(", ");
                        sb.Append(Name(order.Keys[i].Column)).Append(order.Keys[i].Descending ? " desc" : " asc");
                    }
                    break;
                case GroupByClause group:
                    sb.Append("group by ");
                    AppendNames(sb, group.Keys);
                    sb.Append(" compute");
                    AppendItems(sb, group.Computes, indent + "  ", " = ");
                    continue;
                case JoinClause join:
                    sb.Append("join ").Append(Name(join.Other)).Append(" on ").Append(Name(join.LeftKey));
                    if (join.RightKey is not null) sb.Append(" = ").Append(Name(join.RightKey));
                    sb.Append(join.Kind == JoinKind.Left ? " left" : " inner");
                    break;
                case AppendClause append:
                    sb.Append("append ").Append(Name(append.Other));
                    break;
                case DistinctClause distinct:
                    sb.Append("distinct");
                    if (distinct.Columns.Count > 0) sb.Append(' ');
                    AppendNames(sb, distinct.Columns);
                    break;
                default:
                    sb.Append(clause.GetType().Name);
                    break;
            }
            sb.Append('\n');
        }
    }

    /// <summary>Items of add, fill and compute: one line each, below the clause line.</summary>
    private static void AppendItems(StringBuilder sb, IReadOnlyList<NamedExpr> items, string indent, string separator)
    {
        sb.Append('\n');
        foreach (var item in items)
        {
            sb.Append(indent).Append(Name(item.Name)).Append(separator);
            AppendExpr(sb, item.Value);
            sb.Append('\n');
        }
    }

    private static void AppendNames(StringBuilder sb, IReadOnlyList<Identifier> names)
    {
        for (var i = 0; i < names.Count; i++)
        {
            if (i > 0) sb.Append(", ");
            sb.Append(Name(names[i]));
        }
    }

    private static string Name(Identifier id) => FormatName(id.Name) + "@" + id.Span.ToString();

    private static string CastName(CastTarget target) => target switch
    {
        CastTarget.Int64 => "int64",
        CastTarget.Float64 => "float64",
        CastTarget.Bool => "bool",
        CastTarget.String => "string",
        _ => "timestamp",
    };

    private static string BinaryText(BinaryOp op) => op switch
    {
        BinaryOp.Or => "or",
        BinaryOp.And => "and",
        BinaryOp.Eq => "=",
        BinaryOp.Ne => "<>",
        BinaryOp.Lt => "<",
        BinaryOp.Le => "<=",
        BinaryOp.Gt => ">",
        BinaryOp.Ge => ">=",
        BinaryOp.Concat => "||",
        BinaryOp.Add => "+",
        BinaryOp.Sub => "-",
        BinaryOp.Mul => "*",
        BinaryOp.Div => "/",
        _ => "%",
    };

    private static void AppendExpr(StringBuilder sb, Expr expr)
    {
        switch (expr)
        {
            case LiteralExpr literal:
                sb.Append(Literal(literal.Value));
                break;
            case ColumnExpr column:
                sb.Append(FormatName(column.Name.Name));
                break;
            case BinaryExpr binary:
                sb.Append('(');
                AppendExpr(sb, binary.Left);
                sb.Append(' ').Append(BinaryText(binary.Op)).Append('@').Append(binary.Span.ToString()).Append(' ');
                AppendExpr(sb, binary.Right);
                sb.Append(')');
                return;
            case UnaryExpr unary:
                sb.Append('(').Append(unary.Op == UnaryOp.Not ? "not" : "-").Append('@').Append(unary.Span.ToString()).Append(' ');
                AppendExpr(sb, unary.Operand);
                sb.Append(')');
                return;
            case IsNullExpr isNull:
                sb.Append('(');
                AppendExpr(sb, isNull.Operand);
                sb.Append(isNull.Negated ? " is not null@" : " is null@").Append(isNull.Span.ToString()).Append(')');
                return;
            case CallExpr call:
                sb.Append(FormatName(call.Function.Name)).Append('@').Append(call.Span.ToString()).Append('(');
                for (var i = 0; i < call.Args.Count; i++)
                {
                    if (i > 0) sb.Append(", ");
                    AppendExpr(sb, call.Args[i]);
                }
                sb.Append(')');
                return;
            default:
                sb.Append(expr.GetType().Name);
                break;
        }
        sb.Append('@').Append(expr.Span.ToString());
    }

    private static string Literal(Value value) => value.Kind switch
    {
        ValueKind.Missing => "null",
        ValueKind.String => FormatString(value.String),
        _ => ValueText.Format(value),
    };
}
