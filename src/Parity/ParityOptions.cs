namespace Parity;

/// <summary>
/// Settings for <see cref="ParityGate"/>. Every property has the default of the <c>parity</c> command, so
/// <c>new ParityOptions()</c> compares <c>legacy</c> with <c>modern</c> against <c>golden/</c> in the current
/// directory.
/// </summary>
public sealed record ParityOptions
{
    /// <summary>
    /// The folder that script paths, the golden folder and load paths are relative to, and that script names
    /// in findings and the golden store are relative to; null means the process's current directory.
    /// </summary>
    public string? WorkingDirectory { get; init; }

    /// <summary>
    /// The modes to run and compare, in order: <c>legacy</c>, <c>modern</c>, <c>all</c>, or a spelling such as
    /// <c>arrow+nan+alias</c> (default <c>legacy</c> and <c>modern</c>).
    /// </summary>
    public IReadOnlyList<string> Modes { get; init; } = ["legacy", "modern"];

    /// <summary>The golden store folder, relative to <see cref="WorkingDirectory"/> (default <c>golden</c>).</summary>
    public string Golden { get; init; } = "golden";

    /// <summary>Largest absolute difference under which two numbers count as equal (default 0: exact).</summary>
    public double FloatTolerance { get; init; }

    /// <summary>The name a script given as text (<see cref="ParityGate.RunText"/>) has in findings and messages.</summary>
    public string ScriptName { get; init; } = "inline.parity";
}
