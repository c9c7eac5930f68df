namespace Parity.Harness.Golden;

/// <summary>The run-time error that stopped a mode, as a golden run file records it (1-based position).</summary>
public sealed record GoldenFailure(string Code, int Line, int Column, string Message);
