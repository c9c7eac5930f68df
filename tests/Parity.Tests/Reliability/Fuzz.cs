using System.Diagnostics;
using System.Globalization;
using System.Text;
using Parity.Engine.Errors;
using Parity.Script.Diagnostics;

namespace Parity.Tests.Reliability;

/// <summary>
/// Shared machinery of the fuzzers: fixed seeds, a time and allocation budget per input, and a tally of
/// outcomes. Quick mode (the default) tries a fixed number of inputs; with the environment variable
/// <c>PARITY_FUZZ_SECONDS=N</c> each fuzzer keeps going, same seed, for N seconds (docs/reliability.md).
/// </summary>
internal static class Fuzz
{
    /// <summary>Wall time one input may take before it counts as a hang (generous: CI machines are shared).</summary>
    public static readonly TimeSpan InputBudget = TimeSpan.FromSeconds(20);

    /// <summary>Bytes one input may allocate on its thread before it counts as unbounded memory.</summary>
    public const long AllocationBudget = 512L * 1024 * 1024;

    /// <summary>Seconds of the long mode, or null in quick mode.</summary>
    public static double? LongSeconds =>
        double.TryParse(Environment.GetEnvironmentVariable("PARITY_FUZZ_SECONDS"), NumberStyles.Float, CultureInfo.InvariantCulture, out var s) && s > 0 ? s : null;

    /// <summary>True while input number <paramref name="done"/> should still be tried.</summary>
    public static bool More(int done, int quickCount, Stopwatch clock) =>
        LongSeconds is { } s ? clock.Elapsed.TotalSeconds < s : done < quickCount;

    /// <summary>
    /// Runs <paramref name="body"/> on a worker with the budgets above and returns its outcome label: "ok" or
    /// an error code. Any exception other than a located <see cref="EngineException"/> / <see cref="ScriptException"/>,
    /// an E-INTERNAL (a bug caught by a safety net), a hang or an allocation above budget fails the test,
    /// naming <paramref name="describe"/> so the input can be reproduced.
    /// </summary>
    public static string Outcome(Func<string> body, Func<string> describe, long allocationBudget = AllocationBudget)
    {
        long allocated = 0;
        var task = Task.Factory.StartNew(() =>
        {
            var before = GC.GetAllocatedBytesForCurrentThread();
            try
            {
                return body();
            }
            finally
            {
                allocated = GC.GetAllocatedBytesForCurrentThread() - before;
            }
        }, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        if (!((IAsyncResult)task).AsyncWaitHandle.WaitOne(InputBudget))
            Assert.Fail("hang: no result within " + InputBudget.TotalSeconds.ToString(CultureInfo.InvariantCulture) + " s for " + describe());
        string outcome;
        try
        {
            outcome = task.GetAwaiter().GetResult();
        }
        catch (EngineException e)
        {
            Assert.True(e.Code != ErrorCodes.Internal, "internal error for " + describe() + ": " + e.Format());
            outcome = e.Code;
        }
        catch (ScriptException e)
        {
            Assert.True(e.Diagnostic.Code != ErrorCodes.Internal, "internal error for " + describe() + ": " + e.Diagnostic.Format());
            outcome = e.Diagnostic.Code;
        }
        catch (Exception e)
        {
            Assert.Fail("unhandled " + e.GetType().Name + " for " + describe() + ": " + e);
            throw;
        }
        Assert.True(allocated < allocationBudget, "allocated " + allocated.ToString(CultureInfo.InvariantCulture) + " bytes for " + describe());
        return outcome;
    }

    /// <summary>Counts one outcome.</summary>
    public static void Tally(SortedDictionary<string, int> tally, string outcome) =>
        tally[outcome] = tally.TryGetValue(outcome, out var n) ? n + 1 : 1;

    public static string Summary(string what, SortedDictionary<string, int> tally)
    {
        var sb = new StringBuilder(what).Append(':');
        var total = 0;
        foreach (var (k, v) in tally)
        {
            sb.Append(' ').Append(k).Append('=').Append(v.ToString(CultureInfo.InvariantCulture));
            total += v;
        }
        return sb.Append(" (total ").Append(total.ToString(CultureInfo.InvariantCulture)).Append(')').ToString();
    }

    /// <summary>One random byte-level edit of <paramref name="data"/> (the mutations of the loader fuzzers).</summary>
    public static byte[] Mutate(byte[] data, Random random, byte[][] tokens)
    {
        var list = new List<byte>(data);
        var edits = random.Next(1, 5);
        for (var e = 0; e < edits; e++)
        {
            var at = list.Count == 0 ? 0 : random.Next(list.Count);
            switch (random.Next(7))
            {
                case 0 when list.Count > 0: // bit flip
                    list[at] ^= (byte)(1 << random.Next(8));
                    break;
                case 1: // truncation
                    list.RemoveRange(at, list.Count - at);
                    break;
                case 2 when list.Count > 0: // deletion of a short run
                    list.RemoveRange(at, Math.Min(random.Next(1, 16), list.Count - at));
                    break;
                case 3: // insertion of a structural or invalid token
                    list.InsertRange(at, tokens[random.Next(tokens.Length)]);
                    break;
                case 4 when list.Count > 0: // random byte
                    list[at] = (byte)random.Next(256);
                    break;
                case 5 when list.Count > 8: // duplicate a chunk elsewhere
                {
                    var from = random.Next(list.Count - 4);
                    var len = Math.Min(random.Next(1, 64), list.Count - from);
                    list.InsertRange(at, list.GetRange(from, len));
                    break;
                }
                default: // overwrite four bytes with an extreme 32-bit value (lengths, counts, offsets)
                    if (list.Count >= at + 4)
                    {
                        var v = random.Next(4) switch { 0 => int.MaxValue, 1 => -1, 2 => 0, _ => random.Next() };
                        var bytes = BitConverter.GetBytes(v);
                        for (var k = 0; k < 4; k++) list[at + k] = bytes[k];
                    }
                    break;
            }
        }
        return [.. list];
    }
}
