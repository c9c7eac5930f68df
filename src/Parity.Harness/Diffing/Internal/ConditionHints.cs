using Parity.Script.Syntax;

namespace Parity.Harness.Diffing.Internal;

/// <summary>
/// Picks the hint for a condition that holds missing values (E-MASK-MISSING) from what the condition is: a
/// string predicate (<c>contains</c>, <c>starts_with</c>, <c>ends_with</c>) gives a missing value under
/// boxed+nan, while a bool column with missing cells is <c>object</c> there; each needs its own fix.
/// </summary>
internal static class ConditionHints
{
    public static string MaskMissing(Statement? statement)
    {
        if (statement is null) return MigrationHints.MaskError;
        var conditions = new List<Expr>();
        Collect(statement, conditions);
        foreach (var c in conditions)
            if (HasStringPredicate(c)) return MigrationHints.MaskError;
        return conditions.Count > 0 ? MigrationHints.MaskBoolError : MigrationHints.MaskError;
    }

    private static void Collect(Statement statement, List<Expr> into)
    {
        switch (statement)
        {
            case LetStatement let:
                Collect(let.Value, into);
                break;
            case SetStatement set:
                if (set.Chain is not null) Collect(set.Chain, into);
                if (set.Condition is not null) into.Add(set.Condition);
                break;
        }
    }

    private static void Collect(Derivation d, List<Expr> into)
    {
        foreach (var clause in d.Clauses)
            if (clause is WhereClause w) into.Add(w.Condition);
    }

    private static bool HasStringPredicate(Expr e) => e switch
    {
        CallExpr call => IsStringPredicate(call.Function.Name) || AnyArg(call),
        BinaryExpr b => HasStringPredicate(b.Left) || HasStringPredicate(b.Right),
        UnaryExpr u => HasStringPredicate(u.Operand),
        IsNullExpr n => HasStringPredicate(n.Operand),
        _ => false,
    };

    private static bool AnyArg(CallExpr call)
    {
        foreach (var a in call.Args)
            if (HasStringPredicate(a)) return true;
        return false;
    }

    private static bool IsStringPredicate(string name) =>
        name.Equals("contains", StringComparison.OrdinalIgnoreCase)
        || name.Equals("starts_with", StringComparison.OrdinalIgnoreCase)
        || name.Equals("ends_with", StringComparison.OrdinalIgnoreCase);
}
