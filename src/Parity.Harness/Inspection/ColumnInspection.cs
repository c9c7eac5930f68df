namespace Parity.Harness.Inspection;

/// <summary>
/// One column of <c>parity inspect</c> (spec §4): its type label per mode (keys <c>legacy</c>, <c>modern</c>,
/// then the 8 spellings in <see cref="Engine.Modes.Mode.All"/> order), missing cells, and the bytes it holds
/// under boxed (<c>legacy</c>) and Arrow (<c>modern</c>) storage.
/// </summary>
public sealed record ColumnInspection(
    string Name,
    IReadOnlyList<KeyValuePair<string, string>> Types,
    int Missing,
    long BytesBoxed,
    long BytesArrow)
{
    /// <summary>The type label under the mode key (<c>legacy</c>, <c>modern</c> or a spelling).</summary>
    public string TypeOf(string key)
    {
        foreach (var kv in Types)
            if (string.Equals(kv.Key, key, StringComparison.Ordinal)) return kv.Value;
        throw new KeyNotFoundException(key);
    }
}
