using Parity.Benchmarks.Quick.Ratios;
using Parity.Engine.Kernels;
using Parity.Engine.Modes;
using Parity.Engine.Values;

namespace Parity.Benchmarks.Quick;

/// <summary>Every ratio of the quick mode, in the order of the performance targets.</summary>
public static class RatioCatalog
{
    public static IReadOnlyList<Ratio> All() =>
    [
        new StringKernelRatio("length.boxed_over_arrow", 3, StringKernels.Length),
        new StringKernelRatio("contains.boxed_over_arrow", 3, Contains),
        new StringKernelRatio("equals.boxed_over_arrow", 3, EqualsLiteral),
        new StringKernelRatio("upper.boxed_over_arrow", 2, StringKernels.Upper),
        new ScanOverKernelRatio("length.scan_over_arrow", StringKernels.Length),
        new ScanOverKernelRatio("contains.scan_over_arrow", Contains),
        new StringBytesRatio(),
        new ReshapeRatio(),
        new LoadRatio("ipc", 50),
        new LoadRatio("parquet", 2),
        new ReferenceFrameRatio("filter", 3),
        new ReferenceFrameRatio("groupsum", 3),
        new ReferenceFrameRatio("sort", 5),
        new ReferenceFrameRatio("join", 10),
        new DiffRatio(),
        new EndToEndRatio(),
    ];

    private static Parity.Engine.Columns.Column Contains(Parity.Engine.Columns.Column s, Mode mode) =>
        StringKernels.Match(StringPredicate.Contains, s, Value.Of("xyz"), mode);

    private static Parity.Engine.Columns.Column EqualsLiteral(Parity.Engine.Columns.Column s, Mode mode) =>
        Comparison.Compare(ComparisonOp.Equal, s, Value.Of("abcdefghijklmno"), mode);
}
