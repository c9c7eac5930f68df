namespace Parity.Harness.Findings;

/// <summary>The <c>kind</c> values of a golden mismatch (docs/reports.md, "golden_mismatches").</summary>
public static class GoldenMismatchKinds
{
    public const string Frame = "frame";
    public const string Schema = "schema";
    public const string Records = "records";
    public const string MissingGolden = "missing-golden";
    public const string StaleGolden = "stale-golden";
}
