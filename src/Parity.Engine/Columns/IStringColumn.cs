namespace Parity.Engine.Columns;

/// <summary>
/// What both string storages offer: the boxed object array (when it holds only strings and missing cells)
/// and the Arrow UTF-8 array.
/// </summary>
public interface IStringColumn
{
    int Length { get; }

    bool IsMissing(int index);

    /// <summary>The string at a non-missing index, decoded only when asked (Arrow storage).</summary>
    string GetString(int index);
}
