using System.Diagnostics;
using System.Globalization;

namespace Parity.Benchmarks.Quick;

/// <summary>
/// The everyday benchmark mode: each ratio's two sides run interleaved, the median of each side is taken,
/// and one line <c>ratio NAME VALUE</c> is printed per ratio, then a short table.
/// </summary>
public static class QuickRunner
{
    public static int Run(IReadOnlyList<Ratio> ratios, TextWriter output, string? only)
    {
        var rows = new List<(Ratio Ratio, double Value, double NumMs, double DenMs)>();
        foreach (var ratio in ratios)
        {
            if (only is not null && !ratio.Name.Contains(only, StringComparison.Ordinal)) continue;
            ratio.Setup();
            try
            {
                ratio.Verify();
                double value, num = 0, den = 0;
                if (ratio.Direct is { } direct)
                {
                    value = direct;
                }
                else
                {
                    ratio.Numerator();
                    ratio.Denominator(); // warm-up, JIT
                    var a = new double[ratio.Repetitions];
                    var b = new double[ratio.Repetitions];
                    for (var i = 0; i < ratio.Repetitions; i++)
                    {
                        b[i] = Time(ratio.Denominator);
                        a[i] = Time(ratio.Numerator);
                    }
                    num = Median(a);
                    den = Median(b);
                    value = num / den;
                }
                output.WriteLine("ratio " + ratio.Name + " " + value.ToString("0.00", CultureInfo.InvariantCulture));
                output.Flush();
                rows.Add((ratio, value, num, den));
            }
            finally
            {
                ratio.Cleanup();
                GC.Collect();
            }
        }
        output.WriteLine();
        output.WriteLine("| ratio | value | target | numerator ms | denominator ms | met |");
        output.WriteLine("|---|---:|---:|---:|---:|---|");
        var allMet = true;
        foreach (var (ratio, value, num, den) in rows)
        {
            var met = value >= ratio.Target;
            allMet &= met;
            output.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"| {ratio.Name} | {value:0.00} | {ratio.Target:0.##} | {num:0.0} | {den:0.0} | {(met ? "yes" : "NO")} |"));
        }
        return allMet ? 0 : 1;
    }

    /// <summary>
    /// One timed call after a full collection, so neither side pays for collecting the other's garbage (the
    /// boxed side leaves millions of objects behind); BenchmarkDotNet likewise forces a collection between
    /// iterations by default. A side's own collections stay in its time.
    /// </summary>
    private static double Time(Action action)
    {
        GC.Collect();
        GC.WaitForPendingFinalizers();
        GC.Collect();
        var sw = Stopwatch.StartNew();
        action();
        return sw.Elapsed.TotalMilliseconds;
    }

    private static double Median(double[] xs)
    {
        Array.Sort(xs);
        return xs.Length % 2 == 1 ? xs[xs.Length / 2] : (xs[xs.Length / 2 - 1] + xs[xs.Length / 2]) / 2;
    }
}
