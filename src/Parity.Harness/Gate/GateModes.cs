using System.Diagnostics.CodeAnalysis;
using Parity.Engine.Modes;
using Parity.Harness.Formatting;

namespace Parity.Harness.Gate;

/// <summary>Mode lists as the user writes them (<c>legacy,modern</c>, <c>all</c>, <c>boxed+null+cow</c>).</summary>
public static class GateModes
{
    /// <summary>The default comparison: <c>legacy</c> against <c>modern</c>.</summary>
    public static IReadOnlyList<Mode> Default { get; } = [Mode.Legacy, Mode.Modern];

    /// <summary>All eight modes.</summary>
    public static IReadOnlyList<Mode> All => Mode.All;

    /// <summary>The mode of a run in one mode when none is named (<c>show</c>): <c>modern</c>.</summary>
    public static Mode DefaultSingle => Mode.Modern;

    /// <summary>The words accepted, for messages.</summary>
    public static string ValidSpellings => Mode.ValidSpellings;

    /// <summary>Parses a comma-separated list; on failure <paramref name="problem"/> says which word is wrong.</summary>
    public static bool TryParseList(string? text, [NotNullWhen(true)] out IReadOnlyList<Mode>? modes, [NotNullWhen(false)] out string? problem)
    {
        problem = null;
        if (Mode.TryParseList(text, out modes, out var bad)) return true;
        problem = "'" + CellText.Safe(bad ?? "") + "' is not a mode; valid: all, " + Mode.ValidSpellings;
        return false;
    }

    /// <summary>Parses one mode; on failure <paramref name="problem"/> says what is accepted.</summary>
    public static bool TryParse(string? text, out Mode mode, [NotNullWhen(false)] out string? problem)
    {
        problem = null;
        if (Mode.TryParse(text, out mode)) return true;
        problem = "'" + (text ?? "") + "' is not a mode; valid: " + Mode.ValidSpellings;
        return false;
    }
}
