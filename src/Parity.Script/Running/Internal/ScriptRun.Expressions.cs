using Parity.Engine.Columns;
using Parity.Engine.Errors;
using Parity.Engine.Frames;
using Parity.Engine.Kernels;
using Parity.Engine.Operations;
using Parity.Script.Diagnostics;
using Parity.Script.Syntax;

namespace Parity.Script.Running.Internal;

internal sealed partial class ScriptRun
{
    /// <summary>Where an expression is evaluated: a frame's table, or (inside <c>compute</c>) its groups.</summary>
    private sealed record Scope(Table Table, string FrameName, GroupIndex? Groups = null, Table? Keys = null)
    {
        /// <summary>Rows of the result: the frame's rows, or one per group.</summary>
        public int Rows => Groups is null ? Table.RowCount : Groups.GroupCount;
    }

    private static readonly Dictionary<string, AggregateFunction> Aggregates = new(StringComparer.Ordinal)
    {
        ["count"] = AggregateFunction.Count,
        ["sum"] = AggregateFunction.Sum,
        ["avg"] = AggregateFunction.Avg,
        ["min"] = AggregateFunction.Min,
        ["max"] = AggregateFunction.Max,
        ["first"] = AggregateFunction.First,
        ["count_distinct"] = AggregateFunction.CountDistinct,
    };

    private Column Eval(Expr expr, Scope scope)
    {
        switch (expr)
        {
            case LiteralExpr lit:
                return Broadcast.Literal(lit.Value, scope.Rows, _mode);
            case ColumnExpr col:
                return ColumnOf(col.Name, scope);
            case UnaryExpr u:
            {
                var operand = Eval(u.Operand, scope);
                return Kernel(u, () => u.Op == UnaryOp.Not ? Logic.Not(operand, _mode) : Arithmetic.Negate(operand, _mode));
            }
            case IsNullExpr isNull:
            {
                var operand = Eval(isNull.Operand, scope);
                return Logic.IsMissing(operand, isNull.Negated, _mode);
            }
            case BinaryExpr b when ComparisonOf(b.Op) is { } cmp && (b.Right is LiteralExpr || b.Left is LiteralExpr):
            {
                // A literal operand stays a scalar: the kernel does not need a column of it.
                if (b.Right is LiteralExpr rl)
                {
                    var left = Eval(b.Left, scope);
                    return Kernel(b, () => Comparison.Compare(cmp, left, rl.Value, _mode));
                }
                var ll = (LiteralExpr)b.Left;
                var right = Eval(b.Right, scope);
                return Kernel(b, () => Comparison.Compare(cmp, ll.Value, right, _mode));
            }
            case BinaryExpr b:
            {
                var left = Eval(b.Left, scope);
                var right = Eval(b.Right, scope);
                if (b.Op == BinaryOp.Concat) Kernel(b, () => { StringBudget.CheckConcat(left, right, _options.MaxStringBytes); return 0; });
                return Kernel(b, () => Binary(b.Op, left, right));
            }
            case CallExpr call:
                return Call(call, scope);
            default:
                throw Error(ErrorCodes.Internal, "unknown expression", expr.Span);
        }
    }

    private static ComparisonOp? ComparisonOf(BinaryOp op) => op switch
    {
        BinaryOp.Eq => ComparisonOp.Equal,
        BinaryOp.Ne => ComparisonOp.NotEqual,
        BinaryOp.Lt => ComparisonOp.Less,
        BinaryOp.Le => ComparisonOp.LessOrEqual,
        BinaryOp.Gt => ComparisonOp.Greater,
        BinaryOp.Ge => ComparisonOp.GreaterOrEqual,
        _ => null,
    };

    private Column Binary(BinaryOp op, Column left, Column right) => op switch
    {
        BinaryOp.Or => Logic.Or(left, right, _mode),
        BinaryOp.And => Logic.And(left, right, _mode),
        BinaryOp.Eq => Comparison.Compare(ComparisonOp.Equal, left, right, _mode),
        BinaryOp.Ne => Comparison.Compare(ComparisonOp.NotEqual, left, right, _mode),
        BinaryOp.Lt => Comparison.Compare(ComparisonOp.Less, left, right, _mode),
        BinaryOp.Le => Comparison.Compare(ComparisonOp.LessOrEqual, left, right, _mode),
        BinaryOp.Gt => Comparison.Compare(ComparisonOp.Greater, left, right, _mode),
        BinaryOp.Ge => Comparison.Compare(ComparisonOp.GreaterOrEqual, left, right, _mode),
        BinaryOp.Concat => StringKernels.Concat(left, right, _mode),
        BinaryOp.Add => Arithmetic.Binary(ArithmeticOp.Add, left, right, _mode),
        BinaryOp.Sub => Arithmetic.Binary(ArithmeticOp.Subtract, left, right, _mode),
        BinaryOp.Mul => Arithmetic.Binary(ArithmeticOp.Multiply, left, right, _mode),
        BinaryOp.Div => Arithmetic.Binary(ArithmeticOp.Divide, left, right, _mode),
        _ => Arithmetic.Binary(ArithmeticOp.Modulo, left, right, _mode),
    };

    /// <summary>Runs a kernel and pins its error on <paramref name="node"/> (the innermost node whose kernel failed).</summary>
    private T Kernel<T>(Node node, Func<T> kernel)
    {
        try
        {
            return kernel();
        }
        catch (EngineException e)
        {
            throw Error(e, node.Span);
        }
    }

    private Column ColumnOf(Identifier name, Scope scope)
    {
        if (scope.Groups is not null)
        {
            var k = scope.Keys!.IndexOf(name.Name);
            if (k >= 0) return scope.Keys.Columns[k];
            if (scope.Table.IndexOf(name.Name) >= 0)
                throw Error(ErrorCodes.AggregatePlace, $"column '{name.Name}' is not a group key; use it inside an aggregate such as first({name.Name})", name.Span);
        }
        var i = scope.Table.IndexOf(name.Name);
        if (i >= 0) return scope.Table.Columns[i];
        throw UnknownColumn(name, scope.Table, scope.FrameName);
    }

    private ScriptException UnknownColumn(Identifier name, Table table, string frameName) =>
        Error(ErrorCodes.UnknownColumn, $"frame '{frameName}' has no column '{name.Name}'" + NameSuggester.DidYouMean(name.Name, table.Names), name.Span);

    private void RequireColumn(Identifier name, Table table, string frameName)
    {
        if (table.IndexOf(name.Name) < 0) throw UnknownColumn(name, table, frameName);
    }

    private Column Call(CallExpr call, Scope scope)
    {
        var fn = call.Function.Name.ToLowerInvariant();
        var args = call.Args;
        if (Aggregates.TryGetValue(fn, out var agg))
        {
            if (scope.Groups is null)
                throw Error(ErrorCodes.AggregatePlace, $"aggregate '{fn}' is only allowed in 'group by ... compute'", call.Span);
            if (fn == "count" && args.Count == 0) agg = AggregateFunction.CountRows;
            else Arity(call, 1, 1);
            Column? input = null;
            if (agg != AggregateFunction.CountRows)
            {
                // The argument is evaluated over the rows of the whole frame, not per group.
                input = Eval(args[0], new Scope(scope.Table, scope.FrameName));
            }
            var groups = scope.Groups;
            var aggregated = Kernel(call, () => Aggregation.Aggregate(agg, input, groups, _mode));
            if (agg == AggregateFunction.Sum) Kernel(call, () => { StringBudget.CheckResult(aggregated, _options.MaxStringBytes, "sum"); return 0; });
            return aggregated;
        }
        switch (fn)
        {
            case "length": Arity(call, 1, 1); return Unary(call, scope, StringKernels.Length);
            case "upper": Arity(call, 1, 1); return Checked(call, Unary(call, scope, StringKernels.Upper));
            case "lower": Arity(call, 1, 1); return Checked(call, Unary(call, scope, StringKernels.Lower));
            case "trim": Arity(call, 1, 1); return Unary(call, scope, StringKernels.Trim);
            case "text": Arity(call, 1, 1); return Unary(call, scope, Casts.Text);
            case "abs": Arity(call, 1, 1); return Unary(call, scope, Functions.Abs);
            case "type_of": Arity(call, 1, 1); return Unary(call, scope, Functions.TypeOf);
            case "substring":
            {
                Arity(call, 3, 3);
                var (s, a, b) = (Eval(args[0], scope), Eval(args[1], scope), Eval(args[2], scope));
                return Kernel(call, () => StringKernels.Substring(s, a, b, _mode));
            }
            case "replace":
            {
                Arity(call, 3, 3);
                var (s, a, b) = (Eval(args[0], scope), Eval(args[1], scope), Eval(args[2], scope));
                Kernel(call, () => { StringBudget.CheckReplace(s, a, b, _options.MaxStringBytes); return 0; });
                return Kernel(call, () => StringKernels.Replace(s, a, b, _mode));
            }
            case "contains":
            case "starts_with":
            case "ends_with":
            {
                Arity(call, 2, 2);
                var p = fn == "contains" ? StringPredicate.Contains : fn == "starts_with" ? StringPredicate.StartsWith : StringPredicate.EndsWith;
                if (args[1] is LiteralExpr lit)
                {
                    var text = Eval(args[0], scope);
                    return Kernel(call, () => StringKernels.Match(p, text, lit.Value, _mode));
                }
                var (s, pattern) = (Eval(args[0], scope), Eval(args[1], scope));
                return Kernel(call, () => StringKernels.Match(p, s, pattern, _mode));
            }
            case "coalesce":
            {
                Arity(call, 1, int.MaxValue);
                var cols = new Column[args.Count];
                for (var i = 0; i < cols.Length; i++) cols[i] = Eval(args[i], scope);
                return Kernel(call, () => Functions.Coalesce(cols, _mode));
            }
            case "round":
            {
                Arity(call, 1, 2);
                var x = Eval(args[0], scope);
                var digits = args.Count == 2 ? Eval(args[1], scope) : Broadcast.Literal(Engine.Values.Value.Of(0L), scope.Rows, _mode);
                return Kernel(call, () => Functions.Round(x, digits, _mode));
            }
            default:
                throw Error(ErrorCodes.UnknownFunction, $"unknown function '{call.Function.Name}'" + NameSuggester.DidYouMean(fn, KnownFunctions), call.Function.Span);
        }
    }

    private static readonly string[] KnownFunctions =
    [
        "length", "upper", "lower", "trim", "substring", "replace", "contains", "starts_with", "ends_with", "text",
        "coalesce", "abs", "round", "type_of", "count", "sum", "avg", "min", "max", "first", "count_distinct",
    ];

    private Column Unary(CallExpr call, Scope scope, Func<Column, Engine.Modes.Mode, Column> kernel)
    {
        var x = Eval(call.Args[0], scope);
        return Kernel(call, () => kernel(x, _mode));
    }

    /// <summary>Case mapping can lengthen a string (Unicode full case mappings), so its result is measured.</summary>
    private Column Checked(CallExpr call, Column result)
    {
        Kernel(call, () => { StringBudget.CheckResult(result, _options.MaxStringBytes, call.Function.Name.ToLowerInvariant()); return 0; });
        return result;
    }

    private void Arity(CallExpr call, int min, int max)
    {
        var n = call.Args.Count;
        if (n >= min && n <= max) return;
        var expected = min == max ? min.ToString(System.Globalization.CultureInfo.InvariantCulture)
            : max == int.MaxValue ? "at least " + min.ToString(System.Globalization.CultureInfo.InvariantCulture)
            : min.ToString(System.Globalization.CultureInfo.InvariantCulture) + " or " + max.ToString(System.Globalization.CultureInfo.InvariantCulture);
        throw Error(ErrorCodes.ArgCount, $"'{call.Function.Name}' takes {expected} argument(s), not {n.ToString(System.Globalization.CultureInfo.InvariantCulture)}", call.Span);
    }
}
