using System.Diagnostics.CodeAnalysis;

namespace Parity.Engine.Modes;

/// <summary>
/// One semantic mode: the three independent axes of spec §2, written <c>STRINGS+MISSING+WRITES</c>.
/// </summary>
public readonly record struct Mode(StringStorage Strings, MissingMarker Missing, WriteSemantics Writes)
{
    /// <summary><c>boxed+nan+alias</c>.</summary>
    public static Mode Legacy { get; } = new(StringStorage.Boxed, MissingMarker.Nan, WriteSemantics.Alias);

    /// <summary><c>arrow+null+cow</c>.</summary>
    public static Mode Modern { get; } = new(StringStorage.Arrow, MissingMarker.Null, WriteSemantics.Cow);

    /// <summary>All eight combinations, in a fixed order (legacy first, modern last).</summary>
    public static IReadOnlyList<Mode> All { get; } = BuildAll();

    public bool IsBoxed => Strings == StringStorage.Boxed;

    public bool IsArrow => Strings == StringStorage.Arrow;

    public bool IsNan => Missing == MissingMarker.Nan;

    public bool IsNull => Missing == MissingMarker.Null;

    public bool IsAlias => Writes == WriteSemantics.Alias;

    public bool IsCow => Writes == WriteSemantics.Cow;

    /// <summary>The full spelling, e.g. <c>boxed+nan+alias</c>.</summary>
    public string Spelling =>
        (IsBoxed ? "boxed" : "arrow") + "+" + (IsNan ? "nan" : "null") + "+" + (IsAlias ? "alias" : "cow");

    /// <summary>The preset name where there is one, else the full spelling.</summary>
    public string Name => this == Legacy ? "legacy" : this == Modern ? "modern" : Spelling;

    public override string ToString() => Name;

    /// <summary>The words accepted by <see cref="TryParse"/>, for usage messages.</summary>
    public static string ValidSpellings =>
        "legacy, modern, or STRINGS+MISSING+WRITES with STRINGS in {boxed, arrow}, MISSING in {nan, null}, WRITES in {alias, cow}";

    public static bool TryParse(string? text, out Mode mode)
    {
        mode = default;
        if (string.IsNullOrWhiteSpace(text))
            return false;
        var t = text.Trim().ToLowerInvariant();
        if (t == "legacy") { mode = Legacy; return true; }
        if (t == "modern") { mode = Modern; return true; }
        var parts = t.Split('+');
        if (parts.Length != 3)
            return false;
        StringStorage s;
        MissingMarker m;
        WriteSemantics w;
        if (parts[0] == "boxed") s = StringStorage.Boxed;
        else if (parts[0] == "arrow") s = StringStorage.Arrow;
        else return false;
        if (parts[1] == "nan") m = MissingMarker.Nan;
        else if (parts[1] == "null") m = MissingMarker.Null;
        else return false;
        if (parts[2] == "alias") w = WriteSemantics.Alias;
        else if (parts[2] == "cow") w = WriteSemantics.Cow;
        else return false;
        mode = new Mode(s, m, w);
        return true;
    }

    public static Mode Parse(string text) =>
        TryParse(text, out var mode) ? mode : throw new FormatException($"'{text}' is not a mode; valid: {ValidSpellings}");

    /// <summary>Parses a comma-separated list such as <c>legacy,modern</c>; an empty list is an error.</summary>
    public static bool TryParseList(string? text, [NotNullWhen(true)] out IReadOnlyList<Mode>? modes, out string? bad)
    {
        modes = null;
        bad = null;
        if (string.IsNullOrWhiteSpace(text)) { bad = text ?? ""; return false; }
        var list = new List<Mode>();
        foreach (var part in text.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            if (part.Equals("all", StringComparison.OrdinalIgnoreCase))
            {
                foreach (var m in All)
                    if (!list.Contains(m)) list.Add(m);
                continue;
            }
            if (!TryParse(part, out var mode)) { bad = part; return false; }
            if (!list.Contains(mode)) list.Add(mode);
        }
        if (list.Count == 0) { bad = text; return false; }
        modes = list;
        return true;
    }

    private static Mode[] BuildAll()
    {
        var all = new List<Mode>(8);
        foreach (var s in new[] { StringStorage.Boxed, StringStorage.Arrow })
            foreach (var m in new[] { MissingMarker.Nan, MissingMarker.Null })
                foreach (var w in new[] { WriteSemantics.Alias, WriteSemantics.Cow })
                    all.Add(new Mode(s, m, w));
        return all.ToArray();
    }
}
