using Parity.Harness.Findings;

namespace Parity.Harness.Reports;

/// <summary>One report format (spec §5): a name for <c>--format</c>, a file name, and the rendering.</summary>
public interface IReportWriter
{
    /// <summary>The name used with <c>--format</c>: <c>md</c>, <c>json</c>, <c>junit</c>, <c>html</c>.</summary>
    string Format { get; }

    /// <summary>The file written into the output directory.</summary>
    string FileName { get; }

    /// <summary>The whole report as text (deterministic: the same report gives the same text).</summary>
    string Render(GateReport report);

    /// <summary>Writes <see cref="FileName"/> into <paramref name="outDir"/> atomically (temporary file, then a move).</summary>
    void Write(GateReport report, string outDir);
}
