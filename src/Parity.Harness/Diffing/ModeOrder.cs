using Parity.Engine.Modes;

namespace Parity.Harness.Diffing;

/// <summary>
/// The canonical order of modes: nearer <c>legacy</c> first (fewer axes flipped away from it; on a tie,
/// boxed before arrow, then nan before null, then alias before cow). Runs, findings and reports use it
/// whatever order <c>--modes</c> gives, so findings read "X in A, Y in B" with A the mode nearer legacy and
/// a swapped <c>--modes</c> gives the same report (docs/workflow.md, "Finding keys").
/// </summary>
public static class ModeOrder
{
    /// <summary>Negative when <paramref name="a"/> comes first.</summary>
    public static int Compare(Mode a, Mode b)
    {
        var c = Flipped(a).CompareTo(Flipped(b));
        if (c != 0) return c;
        c = a.IsBoxed.CompareTo(b.IsBoxed);
        if (c != 0) return -c;
        c = a.IsNan.CompareTo(b.IsNan);
        if (c != 0) return -c;
        return -a.IsAlias.CompareTo(b.IsAlias);
    }

    /// <summary>The modes in canonical order, duplicates kept once.</summary>
    public static IReadOnlyList<Mode> Canonical(IReadOnlyList<Mode> modes)
    {
        var list = new List<Mode>(modes.Count);
        foreach (var m in modes)
            if (!list.Contains(m)) list.Add(m);
        list.Sort(Compare);
        return list;
    }

    private static int Flipped(Mode m) => (m.IsBoxed ? 0 : 1) + (m.IsNan ? 0 : 1) + (m.IsAlias ? 0 : 1);
}
