using Apache.Arrow.Ipc;
using Parity.Engine.IO;
using Parity.Engine.IO.Internal;
using Parity.Engine.Modes;
using Parity.Engine.Values;
using Table = Parity.Engine.Frames.Table;

namespace Parity.Tests.Engine.IO;

/// <summary>
/// A file of several record batches (what our writer makes above 1 GiB, and the only way to read a file above
/// 2 GiB: streamed, docs/reliability.md "Large inputs") gives the rows of every batch in file order, streamed and
/// mapped alike.
/// </summary>
public sealed class ArrowBatchAssemblyTests : IDisposable
{
    private readonly TestFiles _files = new();

    public void Dispose() => _files.Dispose();

    [Fact]
    public void Three_batches_read_streamed_and_mapped_give_every_row_in_order()
    {
        var parts = new[] { Part(0, 3), Part(3, 1), Part(4, 5) };
        var path = _files.PathOf("batches.arrow");
        using (var stream = File.Create(path))
        {
            var first = ArrowIpcWriter.ToRecordBatch(parts[0]);
            using var writer = new ArrowFileWriter(stream, first.Schema, leaveOpen: true);
            writer.WriteRecordBatch(first);
            writer.WriteRecordBatch(ArrowIpcWriter.ToRecordBatch(parts[1]));
            writer.WriteRecordBatch(ArrowIpcWriter.ToRecordBatch(parts[2]));
            writer.WriteEnd();
        }
        foreach (var mode in new[] { Mode.Legacy, Mode.Modern })
        {
            var streamed = ArrowSourceReader.ReadStreamed(path, "batches.arrow").ToTable(mode);
            DataLoader.ClearCache();
            var mapped = DataLoader.Load(path, LoadOptions.Default, mode);
            foreach (var t in new[] { streamed, mapped })
            {
                Assert.Equal(9, t.RowCount);
                for (var r = 0; r < 9; r++)
                {
                    Assert.Equal((long)r, t["id"].GetValue(r).Int64);
                    Assert.Equal(r % 3 == 2, t["name"].IsMissing(r));
                    if (r % 3 != 2) Assert.Equal(Name(r), t["name"].GetValue(r).String);
                }
            }
        }
    }

    private static string Name(int r) => r % 2 == 0 ? "Σοφία " + r : "山田 🚢 " + r;

    private static Table Part(int from, int count)
    {
        var ids = new Value[count];
        var names = new Value[count];
        for (var i = 0; i < count; i++)
        {
            var r = from + i;
            ids[i] = Value.Of((long)r);
            names[i] = r % 3 == 2 ? Value.Null : Value.Of(Name(r));
        }
        return Parity.Tests.Script.Running.Harbor.Build(Mode.Modern, count, ("id", ids), ("name", names));
    }
}
