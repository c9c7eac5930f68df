using Parity.Engine.Values;
using Parity.Harness.Formatting;

namespace Parity.Harness.Showing;

/// <summary>
/// The text of one cell and of a name in the <c>show</c> table: the shared cell text (strings quoted,
/// missing markers bare, non-finite float values prefixed, control characters escaped).
/// </summary>
internal static class ShowCell
{
    public static string Display(Value v) => CellText.Display(v);

    public static string Safe(string s) => CellText.Safe(s);
}
