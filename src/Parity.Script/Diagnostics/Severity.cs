namespace Parity.Script.Diagnostics;

public enum Severity
{
    Error,
    Warning,
}
