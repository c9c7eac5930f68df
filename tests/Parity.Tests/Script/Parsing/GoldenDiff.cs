using System.Globalization;
using System.Text;

namespace Parity.Tests.Script.Parsing;

/// <summary>A readable failure message: the first differing line with a few lines of context on each side.</summary>
internal static class GoldenDiff
{
    public static string Describe(string name, string expected, string actual)
    {
        var e = expected.Split('\n');
        var a = actual.Split('\n');
        var first = 0;
        while (first < e.Length && first < a.Length && e[first] == a[first]) first++;
        var from = Math.Max(0, first - 3);
        var sb = new StringBuilder();
        sb.Append(name).Append(" differs at line ").Append((first + 1).ToString(CultureInfo.InvariantCulture))
            .Append(" (set PARITY_UPDATE_GOLDEN=1 to accept the new output)\n");
        sb.Append("--- expected\n");
        for (var i = from; i < Math.Min(e.Length, first + 4); i++) sb.Append(i == first ? "> " : "  ").Append(e[i]).Append('\n');
        sb.Append("+++ actual\n");
        for (var i = from; i < Math.Min(a.Length, first + 4); i++) sb.Append(i == first ? "> " : "  ").Append(a[i]).Append('\n');
        return sb.ToString();
    }
}
