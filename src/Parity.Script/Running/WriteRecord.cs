namespace Parity.Script.Running;

/// <summary>
/// One executed write statement: where it stands and the named frames whose contents it changed in this
/// mode, sorted ordinally (the "aliasing set" the differ compares between modes).
/// </summary>
public sealed record WriteRecord(int Line, int Column, string Target, IReadOnlyList<string> ChangedFrames);
