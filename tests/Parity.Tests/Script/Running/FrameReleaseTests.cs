using Parity.Engine.Frames;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Script.Parsing;
using Parity.Script.Running;
using Parity.Script.Running.Internal;

namespace Parity.Tests.Script.Running;

/// <summary>
/// A run lets go of frames no later statement mentions (memory on large inputs, docs/reliability.md). Nothing
/// a run records may change because of it: aliasing sets still name a released frame's view relatives, and
/// checkpoints keep their values.
/// </summary>
public sealed class FrameReleaseTests
{
    [Fact]
    public void Last_mentions_count_reads_writes_checks_joins_and_appends()
    {
        var parsed = ScriptParser.Parse(
            "load a from 'a.csv'\nload b from 'b.csv'\nlet c = a join b on id\nset c.x = 1\nlet d = c append a\ncheck d\n", "t.parity");
        var last = FrameLifetimes.LastMentions(parsed.Script.Statements);
        Assert.Equal([[], [], ["b"], [], ["a", "c"], ["d"]], last.Select(l => l.ToArray()));
    }

    [Fact]
    public void A_parent_no_longer_mentioned_still_shows_in_the_aliasing_set_of_its_view()
    {
        // tickets is last mentioned when v is made; under alias v shares its slots, so the write reaches it.
        var legacy = Harbor.Ok("let v = tickets take 2\nset v.fare = 0\nlet w = v where fare = 0\nset w.fare = 1\n", Mode.Legacy);
        Assert.Equal(["tickets", "v"], legacy.Writes[0].ChangedFrames);
        Assert.Equal(["w"], legacy.Writes[1].ChangedFrames);
        var modern = Harbor.Ok("let v = tickets take 2\nset v.fare = 0\n", Mode.Modern);
        Assert.Equal(["v"], modern.Writes[0].ChangedFrames);
    }

    [Fact]
    public void A_view_of_a_released_frame_keeps_it_until_the_view_goes_too()
    {
        // u is a view of tickets, tickets is never mentioned after u is made, then a write into u must still
        // list tickets; after that neither is mentioned and both can go.
        var run = Harbor.Ok("let u = tickets skip 3\nlet x = sailings take 1\nset u.note = 'seen'\ncheck x\n", Mode.Legacy);
        Assert.Equal(["tickets", "u"], run.Writes[0].ChangedFrames);
    }

    [Fact]
    public void Checkpoints_of_released_frames_keep_their_values()
    {
        foreach (var mode in new[] { Mode.Legacy, Mode.Modern })
        {
            var run = Harbor.Ok("let a = tickets where fare > 0\ncheck a\nlet b = sailings take 1\ncheck b\n", mode);
            Assert.Equal(4, run.Check("a").RowCount);
            Assert.Equal(1, run.Check("b").RowCount);
        }
    }

    [Fact]
    public void A_load_that_keeps_no_parse_drops_the_cached_one()
    {
        var path = Path.Combine(Harbor.Dir, "release-cache.csv");
        File.WriteAllText(path, "id,name\n1,Ola\n2,Zoë\n");
        DataLoader.ClearCache();
        var first = DataLoader.ReadSource(path, LoadOptions.Default);
        Assert.Same(first, DataLoader.ReadSource(path, LoadOptions.Default));
        // A small file stays cached anyway; with the size floor at 0 the last load drops it.
        Assert.Same(first, DataLoader.ReadSource(path, LoadOptions.Default with { KeepParsed = false }));
        Assert.Same(first, DataLoader.ReadSource(path, LoadOptions.Default));
        var dropping = LoadOptions.Default with { KeepParsed = false, AlwaysKeepBelowBytes = 0 };
        var last = DataLoader.ReadSource(path, dropping);
        Assert.Same(first, last);
        Assert.NotSame(first, DataLoader.ReadSource(path, dropping));
        Assert.Equal(2, DataLoader.Load(path, dropping, Mode.Legacy).RowCount);
    }

    [Fact]
    public void Derive_under_alias_copies_only_the_columns_it_shares_with_its_input()
    {
        var input = Harbor.Tickets(Mode.Legacy);
        var fresh = input.Columns[1].Clone();
        var result = new Table(["ticket_id", "sailing_id"], [input.Columns[0], fresh], input.RowCount);
        var frame = Frame.Derive(result, Mode.Legacy, input);
        Assert.NotSame(input.Columns[0], frame.Columns[0].Column);
        Assert.Same(fresh, frame.Columns[1].Column);
    }
}
