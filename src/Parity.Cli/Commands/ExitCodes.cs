namespace Parity.Cli.Commands;

/// <summary>Exit codes of spec §4.</summary>
public static class ExitCodes
{
    public const int Passed = 0;
    public const int GateFailed = 1;
    public const int BadInput = 2;
}
