using System.Globalization;
using System.Text;
using FsCheck.Xunit;
using Parity.Engine.Modes;
using Parity.Script.Parsing;
using Parity.Script.Running;

namespace Parity.Tests.Script.Running;

/// <summary>
/// Spec §2.2 ownership invariants as properties: random sequences of derivations (take, skip, column, where,
/// select) and writes run under alias and cow and are checked against an independent model of storage.
/// Under cow no write ever changes another frame; under alias a write through a view shows in its parent and
/// vice versa; a frame's values change only when a write targeted it or (alias only) a view relative.
/// </summary>
public sealed class OwnershipPropertyTests
{
    private const int Rows = 8;

    private sealed class M
    {
        public required string Name { get; init; }
        public required double[] Storage { get; init; }
        public int Offset { get; init; }
        public int Length { get; init; }
        public int[]? Ids { get; init; }

        public double[] Values() => Storage.AsSpan(Offset, Length).ToArray();
    }

    private static readonly Lazy<string> Folder = new(() =>
    {
        var dir = Path.Combine(Harbor.Dir, "own");
        Directory.CreateDirectory(dir);
        var sb = new StringBuilder("ticket_id,fare\n");
        for (var i = 1; i <= Rows; i++) sb.Append(CultureInfo.InvariantCulture, $"{i},{i}.25\n");
        File.WriteAllText(Path.Combine(dir, "own.csv"), sb.ToString());
        return dir;
    });

    [Property(MaxTest = 80)]
    public bool Alias_matches_the_shared_storage_model(int[] codes) => Check(codes, Mode.Legacy);

    [Property(MaxTest = 80)]
    public bool Cow_matches_the_independent_copy_model(int[] codes) => Check(codes, Mode.Modern);

    [Property(MaxTest = 40)]
    public bool Mixed_modes_follow_their_write_axis(int[] codes) =>
        Check(codes, new Mode(StringStorage.Arrow, MissingMarker.Nan, WriteSemantics.Alias))
        && Check(codes, new Mode(StringStorage.Boxed, MissingMarker.Null, WriteSemantics.Cow));

    private static bool Check(int[]? codes, Mode mode)
    {
        var frames = new List<M> { new() { Name = "f0", Storage = Enumerable.Range(1, Rows).Select(i => i + 0.25).ToArray(), Length = Rows, Ids = Enumerable.Range(1, Rows).ToArray() } };
        var script = new StringBuilder("load f0 from 'own.csv'\n");
        var expectedChanges = new List<string[]>();
        var writeTargets = new List<string>();
        var k = 0;
        foreach (var raw in (codes ?? []).Take(14))
        {
            var c = raw & int.MaxValue;
            var src = frames[(c / 7) % frames.Count];
            var kind = c % 7;
            var n = (c / 70) % (Rows + 1);
            var name = "f" + frames.Count.ToString(CultureInfo.InvariantCulture);
            if (kind >= 5)
            {
                k++;
                var value = k + 0.5;
                var useWhere = kind == 6 && src.Ids is not null;
                var before = frames.ToDictionary(f => f.Name, f => f.Values());
                for (var i = 0; i < src.Length; i++)
                    if (!useWhere || src.Ids![i] >= n) src.Storage[src.Offset + i] = value;
                script.Append(CultureInfo.InvariantCulture, $"set {src.Name}.fare = {value.ToString(CultureInfo.InvariantCulture)}{(useWhere ? " where ticket_id >= " + n.ToString(CultureInfo.InvariantCulture) : "")}\n");
                expectedChanges.Add(frames.Where(f => !f.Values().SequenceEqual(before[f.Name])).Select(f => f.Name).OrderBy(x => x, StringComparer.Ordinal).ToArray());
                writeTargets.Add(src.Name);
                continue;
            }
            M next;
            string clause;
            switch (kind)
            {
                case 0:
                case 1:
                {
                    var len = Math.Min(n, src.Length);
                    var off = kind == 0 ? 0 : len;
                    var count = kind == 0 ? len : src.Length - len;
                    clause = (kind == 0 ? "take " : "skip ") + n.ToString(CultureInfo.InvariantCulture);
                    next = mode.IsAlias
                        ? new M { Name = name, Storage = src.Storage, Offset = src.Offset + off, Length = count, Ids = src.Ids?[off..(off + count)] }
                        : new M { Name = name, Storage = src.Values()[off..(off + count)], Length = count, Ids = src.Ids?[off..(off + count)] };
                    break;
                }
                case 2:
                    clause = "column fare";
                    next = mode.IsAlias
                        ? new M { Name = name, Storage = src.Storage, Offset = src.Offset, Length = src.Length }
                        : new M { Name = name, Storage = src.Values(), Length = src.Length };
                    break;
                case 3 when src.Ids is not null:
                {
                    clause = "where ticket_id >= " + n.ToString(CultureInfo.InvariantCulture);
                    var keep = Enumerable.Range(0, src.Length).Where(i => src.Ids[i] >= n).ToArray();
                    next = new M { Name = name, Storage = keep.Select(i => src.Storage[src.Offset + i]).ToArray(), Length = keep.Length, Ids = keep.Select(i => src.Ids[i]).ToArray() };
                    break;
                }
                default:
                    clause = src.Ids is null ? "select fare" : "select fare, ticket_id";
                    next = new M { Name = name, Storage = src.Values(), Length = src.Length, Ids = src.Ids?.ToArray() };
                    break;
            }
            script.Append(CultureInfo.InvariantCulture, $"let {name} = {src.Name} {clause}\n");
            frames.Add(next);
        }
        foreach (var f in frames) script.Append(CultureInfo.InvariantCulture, $"check {f.Name}\n");

        var parsed = ScriptParser.Parse(script.ToString(), "own.parity");
        var run = Interpreter.Run(parsed.Script, mode, Folder.Value, new RunOptions { Root = Folder.Value });
        if (run.Failure is not null) throw new InvalidOperationException(run.Failure.Format() + "\n" + script);
        foreach (var f in frames)
        {
            var t = run.FindCheckpoint(f.Name)!.Table;
            var col = t["fare"];
            var got = Enumerable.Range(0, col.Length).Select(i => col.GetValue(i).AsDouble).ToArray();
            if (!got.SequenceEqual(f.Values())) throw new InvalidOperationException($"{mode}: frame {f.Name} differs from the model\n{script}");
        }
        for (var w = 0; w < run.Writes.Count; w++)
        {
            var actual = run.Writes[w].ChangedFrames;
            if (!actual.SequenceEqual(expectedChanges[w])) throw new InvalidOperationException($"{mode}: write {w} changed [{string.Join(",", actual)}], model [{string.Join(",", expectedChanges[w])}]\n{script}");
            // Cow: a write reaches its target only.
            if (mode.IsCow && actual.Any(x => x != writeTargets[w])) return false;
        }
        return run.Writes.Count == expectedChanges.Count;
    }
}
