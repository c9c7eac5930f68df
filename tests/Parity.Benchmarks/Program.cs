using BenchmarkDotNet.Running;
using Parity.Benchmarks.Quick;

namespace Parity.Benchmarks;

internal static class Program
{
    /// <summary>
    /// <c>quick [FILTER]</c>: the ratio mode (one <c>ratio NAME VALUE</c> line each, then a table);
    /// <c>wide ROWS OUT.csv [SEED]</c>: the seeded 20-column table of the large-input measurements;
    /// <c>convert FILE.csv</c>: Arrow IPC and Parquet copies for the large-input measurements;
    /// anything else goes to BenchmarkDotNet's switcher (<c>--filter *LengthBench*</c>).
    /// </summary>
    private static int Main(string[] args)
    {
        if (args.Length is 3 or 4 && args[0] == "wide")
            return Data.WideGenerator.Run(args[1], args[2], args.Length == 4 ? args[3] : null);
        if (args.Length == 2 && args[0] == "convert")
            return Data.WideConverter.Run(args[1]);
        if (args.Length > 0 && args[0] == "quick")
            return QuickRunner.Run(RatioCatalog.All(), Console.Out, args.Length > 1 ? args[1] : null);
        BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
        return 0;
    }
}
