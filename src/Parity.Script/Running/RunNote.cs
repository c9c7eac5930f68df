namespace Parity.Script.Running;

/// <summary>
/// A counted event worth reporting: rows dropped because a condition was null (<see cref="NullCondition"/>),
/// rows dropped from grouping because the key was missing (<see cref="MissingGroupKey"/>).
/// </summary>
public sealed record RunNote(string Kind, int Line, int Column, long Count, string Message)
{
    public const string NullCondition = "null-condition";
    public const string MissingGroupKey = "missing-group-key";
}
