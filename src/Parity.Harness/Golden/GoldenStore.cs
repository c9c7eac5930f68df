using Parity.Harness.Storage;
using System.Text;
using Parity.Engine.Errors;
using Parity.Engine.Files;
using Parity.Engine.Modes;
using Parity.Harness.Findings;
using Parity.Harness.Formatting;
using Parity.Script.Running;

namespace Parity.Harness.Golden;

/// <summary>
/// The golden store (spec §5, docs/golden-format.md): one folder per script under <see cref="Root"/>, one
/// sub-folder per mode with a run file and one text file per checkpoint (plus an Arrow IPC file for frames
/// above <see cref="RowLimit"/> rows), and the accepted cross-mode findings.
/// <para>
/// An accept renders every file in memory, writes them into a fresh staging folder, then swaps it in with
/// two renames (old folder aside, staging folder in place, old folder deleted). A process killed at any
/// point leaves the previous folder or the new one: readers fall back to the set-aside folder when the
/// swap stopped between the renames, and the next accept finishes the recovery. Accepts hold
/// <see cref="GoldenLock"/>.
/// </para>
/// </summary>
public sealed class GoldenStore
{
    public const int DefaultRowLimit = 1000;
    private const string NewSuffix = "~~accept-new";
    private const string OldSuffix = "~~accept-old";
    private const string PruneSuffix = "~~prune-old";
    private static readonly UTF8Encoding Utf8 = new(false);

    public GoldenStore(string root, string displayRoot, int rowLimit = DefaultRowLimit)
    {
        Root = Path.GetFullPath(root);
        DisplayRoot = displayRoot.Replace('\\', '/').TrimEnd('/');
        RowLimit = rowLimit;
    }

    public string Root { get; }

    /// <summary>The root as the user wrote it, for messages.</summary>
    public string DisplayRoot { get; }

    public int RowLimit { get; }

    /// <summary>Test hook: called after each staged file is written (a throw simulates a crash mid-accept).</summary>
    internal Action<string>? AfterStagedFile { get; set; }

    /// <summary>Test hook: called between the two renames of the swap.</summary>
    internal Action? BetweenRenames { get; set; }

    public string ScriptFolder(string script) => Path.Combine(Root, GoldenNames.ScriptFolder(script));

    private string Display(string script, string relative) =>
        DisplayRoot + "/" + GoldenNames.ScriptFolder(script) + "/" + relative;

    /// <summary>The folder to read, or null: the script folder, or its set-aside copy when a swap was cut short.</summary>
    private string? ReadableFolder(string script)
    {
        var dir = ScriptFolder(script);
        if (Directory.Exists(dir)) return dir;
        var old = dir + OldSuffix;
        return Directory.Exists(old) ? old : null;
    }

    public bool Exists(string script) => ReadableFolder(script) is not null;

    // ---- accept -----------------------------------------------------------------------------------

    /// <summary>
    /// Writes or refreshes the snapshot of <paramref name="script"/>: every mode's frames and run file and
    /// the accepted findings, or, with <paramref name="checkpoint"/>, only that checkpoint's frames and
    /// findings (the rest kept as they were).
    /// </summary>
    public void Accept(string script, IReadOnlyList<ModeRun> runs, IReadOnlyList<Finding> findings, string? checkpoint = null)
    {
        using var _ = GoldenLock.Acquire(Root, DisplayRoot);
        var dir = ScriptFolder(script);
        Recover(dir);
        var files = checkpoint is null ? new SortedDictionary<string, byte[]>(StringComparer.Ordinal) : ReadAll(dir, script);
        if (checkpoint is not null)
        {
            var reached = false;
            foreach (var run in runs) reached |= run.FindCheckpoint(checkpoint) is not null;
            if (!reached) throw new EngineException(ErrorCodes.Usage, "no mode reached a checkpoint labelled " + CellText.Quote(checkpoint) + " in " + script);
        }
        foreach (var run in runs)
        {
            var mode = run.Mode.Name;
            var runFile = mode + "/" + GoldenNames.RunFile;
            if (checkpoint is null || !files.ContainsKey(runFile)) files[runFile] = Utf8.GetBytes(GoldenRunText.Write(run));
            if (checkpoint is not null)
            {
                files.Remove(mode + "/" + GoldenNames.FrameFile(checkpoint));
                files.Remove(mode + "/" + GoldenNames.ArrowFile(checkpoint));
            }
            foreach (var c in run.Checkpoints)
            {
                if (checkpoint is not null && !string.Equals(c.Label, checkpoint, StringComparison.Ordinal)) continue;
                var arrowName = GoldenNames.ArrowFile(c.Label);
                files[mode + "/" + GoldenNames.FrameFile(c.Label)] = Utf8.GetBytes(GoldenFrameText.Write(c.Label, mode, c.Table, RowLimit, arrowName));
                if (c.Table.RowCount > RowLimit) files[mode + "/" + arrowName] = GoldenArrow.Write(c.Label, run.Mode, c.Table);
            }
        }
        var accepted = new List<AcceptedFinding>();
        if (checkpoint is not null && files.TryGetValue(GoldenNames.FindingsFile, out var existing))
        {
            var kept = GoldenFindingsText.Read(Utf8.GetString(existing), Display(script, GoldenNames.FindingsFile)).Findings;
            if (kept.Count > 0 && kept[0].Version == 1)
            {
                // A version 1 file cannot be written back as it is (it has no statement keys or differences):
                // the current findings it accepted stand in for its entries, with the counts accepted then.
                foreach (var f in ApplyAccepted(findings, kept, script))
                {
                    if (f.Status is not (FindingStatus.Accepted or FindingStatus.Changed)) continue;
                    if (string.Equals(f.Checkpoint, checkpoint, StringComparison.Ordinal)) continue;
                    accepted.Add(GoldenFindingsText.FromFinding(f with { Count = f.AcceptedCount ?? f.Count }));
                }
            }
            else
            {
                foreach (var a in kept)
                    if (!string.Equals(a.Checkpoint, checkpoint, StringComparison.Ordinal)) accepted.Add(a);
            }
        }
        foreach (var f in findings)
        {
            if (f.Status == FindingStatus.Resolved) continue;
            if (checkpoint is not null && !string.Equals(f.Checkpoint, checkpoint, StringComparison.Ordinal)) continue;
            accepted.Add(GoldenFindingsText.FromFinding(f));
        }
        accepted.Sort(AcceptedOrder);
        files[GoldenNames.FindingsFile] = Utf8.GetBytes(GoldenFindingsText.Write(script, accepted));
        Swap(dir, files);
    }

    private static int AcceptedOrder(AcceptedFinding x, AcceptedFinding y)
    {
        var c = x.Line.CompareTo(y.Line);
        if (c != 0) return c;
        c = string.CompareOrdinal(x.Checkpoint, y.Checkpoint);
        if (c != 0) return c;
        c = KindIndex(x.Kind).CompareTo(KindIndex(y.Kind));
        if (c != 0) return c;
        c = string.CompareOrdinal(x.Column, y.Column);
        return c != 0 ? c : string.CompareOrdinal(string.Join(",", x.Modes), string.Join(",", y.Modes));
    }

    private static int KindIndex(string label)
    {
        var i = 0;
        foreach (var k in Enum.GetValues<FindingKind>())
        {
            if (string.Equals(k.ToString().ToLowerInvariant(), label, StringComparison.Ordinal)) return i;
            i++;
        }
        return i;
    }

    /// <summary>
    /// The files of a script folder, kept by an accept of one checkpoint. A symbolic link is refused: carrying
    /// it over would copy whatever it names (a key file, <c>/proc/self/environ</c>) into a regular golden file.
    /// </summary>
    private SortedDictionary<string, byte[]> ReadAll(string dir, string script)
    {
        var files = new SortedDictionary<string, byte[]>(StringComparer.Ordinal);
        if (SafeFile.IsLink(dir))
            throw new EngineException(ErrorCodes.Golden, "the script's golden folder is a symbolic link; golden folders are never links: delete it and run `parity accept` again", Display(script, ""), 0, 0);
        if (!Directory.Exists(dir)) return files;
        ReadTree(dir, "", files, script);
        return files;
    }

    private void ReadTree(string dir, string prefix, SortedDictionary<string, byte[]> files, string script)
    {
        foreach (var entry in new DirectoryInfo(dir).GetFileSystemInfos())
        {
            var rel = prefix + entry.Name;
            if (entry.Name.StartsWith('.')) continue; // temporary files of a cut-short write
            if (entry.LinkTarget is not null)
                throw new EngineException(ErrorCodes.Golden, "a symbolic link in the golden store; golden files are regular files: delete it and run `parity accept` again", Display(script, rel), 0, 0);
            if (entry is DirectoryInfo) ReadTree(entry.FullName, rel + "/", files, script);
            else files[rel] = SafeFile.ReadAllBytes(entry.FullName, Rules(Display(script, rel), MaxArrowBytes));
        }
    }

    /// <summary>The largest golden text file read (frames above the row limit keep their data in Arrow files).</summary>
    public const long MaxTextBytes = 256L << 20;

    /// <summary>The largest golden Arrow data file read.</summary>
    public const long MaxArrowBytes = (2L << 30) - 64;

    private FileReadRules Rules(string display, long maxBytes) => new()
    {
        Display = display,
        Root = Root,
        RootDisplay = DisplayRoot,
        OutsideHint = "golden files are read only from inside the golden store",
        MaxBytes = maxBytes,
        SizeCode = ErrorCodes.Golden,
        SizeHint = "golden files are capped; see docs/reliability.md",
    };

    private string ReadText(string path, string display) => Utf8.GetString(SafeFile.ReadAllBytes(path, Rules(display, MaxTextBytes)));

    /// <summary>Deletes a folder, or only the link when it is a symbolic link (never what it points to).</summary>
    private static void RemoveTree(string path)
    {
        if (SafeFile.IsLink(path)) File.Delete(path);
        else if (Directory.Exists(path)) Directory.Delete(path, recursive: true);
    }

    private void Swap(string dir, SortedDictionary<string, byte[]> files)
    {
        var fresh = dir + NewSuffix;
        var old = dir + OldSuffix;
        RemoveTree(fresh);
        Directory.CreateDirectory(fresh);
        foreach (var (rel, bytes) in files)
        {
            var path = Path.Combine(fresh, rel);
            AtomicFile.WriteAllBytes(path, bytes);
            AfterStagedFile?.Invoke(path);
        }
        // A link in place of the folder is replaced, never written through.
        if (SafeFile.IsLink(dir)) File.Delete(dir);
        else if (Directory.Exists(dir)) Directory.Move(dir, old);
        BetweenRenames?.Invoke();
        Directory.Move(fresh, dir);
        // The new snapshot is live: failing to clear the old one away is no failure of the accept.
        // Read-only entries are made writable first; what still resists is removed by the next accept.
        try
        {
            RemoveTree(old);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            MakeWritable(old);
            try { RemoveTree(old); }
            catch (Exception again) when (again is IOException or UnauthorizedAccessException) { }
        }
    }

    private static void MakeWritable(string path)
    {
        if (OperatingSystem.IsWindows() || !Directory.Exists(path) || SafeFile.IsLink(path)) return;
        try
        {
            var info = new DirectoryInfo(path);
            info.UnixFileMode |= UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute;
            foreach (var sub in info.GetDirectories())
                MakeWritable(sub.FullName);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { }
    }

    /// <summary>Finishes or rolls back a swap cut short by a killed accept (called under the lock).</summary>
    private static void Recover(string dir)
    {
        var old = dir + OldSuffix;
        var fresh = dir + NewSuffix;
        if (!Directory.Exists(dir) && Directory.Exists(old)) Directory.Move(old, dir);
        RemoveTree(old);
        RemoveTree(fresh);
    }

    // ---- stale folders ----------------------------------------------------------------------------

    /// <summary>
    /// Golden folders left behind by scripts that are gone: each folder of the store whose script lies under
    /// one of <paramref name="folders"/> (paths relative to the working directory, forward slashes; <c>.</c>
    /// for the working directory itself) but is not in <paramref name="scripts"/> (the scripts found there).
    /// Returns the script paths, sorted ordinally. Only folders the user checked count: a script checked by
    /// path, not by folder, never makes its neighbours stale.
    /// </summary>
    public IReadOnlyList<string> FindStale(IReadOnlyList<string> folders, IReadOnlyCollection<string> scripts)
    {
        var stale = new List<string>();
        if (folders.Count == 0 || !Directory.Exists(Root)) return stale;
        var present = new HashSet<string>(scripts, StringComparer.Ordinal);
        foreach (var dir in Directory.EnumerateDirectories(Root))
        {
            var name = Path.GetFileName(dir);
            if (name.EndsWith(NewSuffix, StringComparison.Ordinal) || name.EndsWith(PruneSuffix, StringComparison.Ordinal)) continue;
            if (name.EndsWith(OldSuffix, StringComparison.Ordinal))
            {
                // A swap cut short: the folder's data lives here until the next accept recovers it.
                if (Directory.Exists(dir[..^OldSuffix.Length])) continue;
                name = name[..^OldSuffix.Length];
            }
            var script = GoldenNames.TryScriptOfFolder(name);
            if (script is null || present.Contains(script)) continue;
            foreach (var f in folders)
            {
                var prefix = f is "." or "" ? "" : f.TrimEnd('/') + "/";
                if (!script.StartsWith(prefix, StringComparison.Ordinal) || script.StartsWith("../", StringComparison.Ordinal)) continue;
                stale.Add(script);
                break;
            }
        }
        stale.Sort(StringComparer.Ordinal);
        return stale;
    }

    /// <summary>The mismatch that reports a stale folder (it fails <c>check</c>).</summary>
    public GoldenMismatch StaleMismatch(string script) => new(script, null, "every mode",
        "stale golden folder " + DisplayRoot + "/" + GoldenNames.ScriptFolder(script) + ": no script " + CellText.Safe(script)
        + " (deleted or renamed?); `parity accept --prune` removes it", "") { Kind = GoldenMismatchKinds.StaleGolden };

    /// <summary>
    /// Removes the golden folder of a script that is gone, under the lock. The folder is first renamed aside
    /// (one atomic step: readers see it whole or not at all), then deleted; a leftover from a killed prune is
    /// deleted by the next one.
    /// </summary>
    public void Prune(string script)
    {
        using var _ = GoldenLock.Acquire(Root, DisplayRoot);
        foreach (var leftover in Directory.EnumerateDirectories(Root, "*" + PruneSuffix))
            Directory.Delete(leftover, recursive: true);
        var dir = ScriptFolder(script);
        var aside = dir + PruneSuffix;
        if (Directory.Exists(dir + OldSuffix)) Directory.Delete(dir + OldSuffix, recursive: true);
        if (Directory.Exists(dir + NewSuffix)) Directory.Delete(dir + NewSuffix, recursive: true);
        if (!Directory.Exists(dir)) return;
        Directory.Move(dir, aside);
        BetweenRenames?.Invoke();
        Directory.Delete(aside, recursive: true);
    }

    // ---- compare ----------------------------------------------------------------------------------

    /// <summary>The accepted findings of <paramref name="script"/>, or null when it has no golden folder or findings file.</summary>
    public IReadOnlyList<AcceptedFinding>? ReadAccepted(string script)
    {
        var dir = ReadableFolder(script);
        if (dir is null) return null;
        var path = Path.Combine(dir, GoldenNames.FindingsFile);
        if (!File.Exists(path)) return null;
        return GoldenFindingsText.Read(ReadText(path, Display(script, GoldenNames.FindingsFile)), Display(script, GoldenNames.FindingsFile)).Findings;
    }

    /// <summary>
    /// Every difference between the runs and their snapshots: a missing folder, run file or checkpoint file,
    /// a file whose text differs (with a line-diff excerpt), a snapshot of a checkpoint the run did not reach.
    /// A corrupted file throws E-GOLDEN at its file:line:col.
    /// </summary>
    public IReadOnlyList<GoldenMismatch> CompareSnapshots(string script, IReadOnlyList<ModeRun> runs)
    {
        var result = new List<GoldenMismatch>();
        var dir = ReadableFolder(script);
        if (dir is null)
        {
            foreach (var run in runs)
                result.Add(new GoldenMismatch(script, null, run.Mode.Name, "no golden snapshot at " + DisplayRoot + "/" + GoldenNames.ScriptFolder(script) + "; run `parity accept` to create it", "") { Kind = GoldenMismatchKinds.MissingGolden });
            return result;
        }
        if (!File.Exists(Path.Combine(dir, GoldenNames.FindingsFile)))
            result.Add(new GoldenMismatch(script, null, ModesText(runs), "no accepted findings file " + Display(script, GoldenNames.FindingsFile), "") { Kind = GoldenMismatchKinds.MissingGolden });
        foreach (var run in runs)
        {
            var mode = run.Mode.Name;
            var modeDir = Path.Combine(dir, mode);
            var runRel = mode + "/" + GoldenNames.RunFile;
            var runPath = Path.Combine(modeDir, GoldenNames.RunFile);
            if (!File.Exists(runPath))
                result.Add(new GoldenMismatch(script, null, mode, "no golden run file " + Display(script, runRel) + "; run `parity accept`", "") { Kind = GoldenMismatchKinds.MissingGolden });
            else
            {
                var stored = GoldenRunText.Read(Normalize(ReadText(runPath, Display(script, runRel))), Display(script, runRel));
                var records = CompareRecords(script, run, stored, Display(script, runRel));
                if (records is not null) result.Add(records);
            }
            var expectedFiles = new HashSet<string>(StringComparer.Ordinal);
            foreach (var c in run.Checkpoints)
            {
                var name = GoldenNames.FrameFile(c.Label);
                expectedFiles.Add(name);
                var rel = mode + "/" + name;
                var path = Path.Combine(modeDir, name);
                if (!File.Exists(path))
                {
                    result.Add(new GoldenMismatch(script, c.Label, mode, "no golden snapshot " + Display(script, rel) + "; run `parity accept`", "") { Kind = GoldenMismatchKinds.MissingGolden, RowsNow = c.Table.RowCount });
                    continue;
                }
                var arrowName = GoldenNames.ArrowFile(c.Label);
                var expected = GoldenFrameText.Write(c.Label, mode, c.Table, RowLimit, arrowName);
                var storedText = Normalize(ReadText(path, Display(script, rel)));
                if (!string.Equals(storedText, expected, StringComparison.Ordinal))
                {
                    GoldenFrameText.Read(storedText, Display(script, rel));
                    result.Add(new GoldenMismatch(script, c.Label, mode, "the frame differs from " + Display(script, rel), Excerpt(storedText, expected)));
                    continue;
                }
                if (c.Table.RowCount > RowLimit) VerifyArrow(script, mode, run.Mode, modeDir, arrowName, storedText, Display(script, rel));
            }
            if (!Directory.Exists(modeDir)) continue;
            var extra = new List<string>();
            foreach (var path in Directory.EnumerateFiles(modeDir, "*" + GoldenNames.FrameSuffix))
                if (!expectedFiles.Contains(Path.GetFileName(path))) extra.Add(path);
            extra.Sort(StringComparer.Ordinal);
            foreach (var path in extra)
            {
                var rel = mode + "/" + Path.GetFileName(path);
                var frame = GoldenFrameText.Read(Normalize(ReadText(path, Display(script, rel))), Display(script, rel));
                result.Add(new GoldenMismatch(script, frame.Label, mode, "the golden store has a snapshot of checkpoint " + CellText.Quote(frame.Label) + " that this run did not reach", "") { Kind = GoldenMismatchKinds.StaleGolden, RowsGolden = frame.Rows });
            }
        }
        return result;
    }

    /// <summary>
    /// The statement records of a run against a golden run file, as records (docs/golden-format.md, "Run
    /// files"): the checkpoints reached in order, and each write, warning, note and error matched by its
    /// statement (canonical text and occurrence), never by line. Null when they agree. A version 1 file names
    /// statements by line: its records are keyed through the current script's lines.
    /// </summary>
    private static GoldenMismatch? CompareRecords(string script, ModeRun run, GoldenRun stored, string display)
    {
        var keys = new Parity.Script.Syntax.StatementKeys(run.Statements);
        var golden = new SortedDictionary<string, (string Content, int Line)>(StringComparer.Ordinal);
        foreach (var r in stored.Records)
            golden[RecordIdentity(r, r.Statement ?? keys.KeyAt(r.Line))] = (r.Content, r.Line);
        var now = new SortedDictionary<string, (string Content, int Line)>(StringComparer.Ordinal);
        foreach (var r in GoldenRunText.Records(run))
            now[RecordIdentity(r, r.Statement!)] = (r.Content, r.Line);
        var changes = new List<GoldenChange>();
        var reached = new List<string>(run.Checkpoints.Count);
        foreach (var c in run.Checkpoints) reached.Add(c.Label);
        if (!reached.SequenceEqual(stored.Checkpoints, StringComparer.Ordinal))
            changes.Add(new GoldenChange(null, null, "checkpoints reached", LabelList(stored.Checkpoints), LabelList(reached)));
        foreach (var (id, g) in golden)
        {
            if (!now.TryGetValue(id, out var n)) changes.Add(new GoldenChange(null, null, id, g.Content, null));
            else if (!string.Equals(g.Content, n.Content, StringComparison.Ordinal)) changes.Add(new GoldenChange(null, null, id, g.Content, n.Content));
        }
        foreach (var (id, n) in now)
            if (!golden.ContainsKey(id)) changes.Add(new GoldenChange(null, null, id, null, n.Content));
        if (changes.Count == 0) return null;
        var excerpt = new StringBuilder();
        foreach (var c in changes)
        {
            excerpt.Append(c.Column).Append('\n');
            if (c.Golden is not null) excerpt.Append("- ").Append(c.Golden).Append('\n');
            if (c.Now is not null) excerpt.Append("+ ").Append(c.Now).Append('\n');
        }
        return new GoldenMismatch(script, null, run.Mode.Name,
            "writes, warnings, notes or the error differ from " + display + " (" + changes.Count.ToString(System.Globalization.CultureInfo.InvariantCulture) + (changes.Count == 1 ? " record)" : " records)"),
            excerpt.ToString())
        {
            Kind = GoldenMismatchKinds.Records,
            Changes = changes,
        };
    }

    private static string RecordIdentity(GoldenRecord r, string statement) =>
        r.Kind + " " + statement + (r.Discriminator.Length == 0 ? "" : " " + r.Discriminator);

    private static string LabelList(IReadOnlyList<string> labels)
    {
        var quoted = new string[labels.Count];
        for (var i = 0; i < quoted.Length; i++) quoted[i] = CellText.Quote(labels[i]);
        return string.Join(", ", quoted);
    }

    private void VerifyArrow(string script, string mode, Mode m, string modeDir, string arrowName, string storedText, string frameDisplay)
    {
        var rel = mode + "/" + arrowName;
        var display = Display(script, rel);
        var path = Path.Combine(modeDir, arrowName);
        if (!File.Exists(path)) throw new EngineException(ErrorCodes.Golden, "the Arrow data file is missing", display, 0, 0);
        var frame = GoldenFrameText.Read(storedText, frameDisplay);
        var table = GoldenArrow.Read(SafeFile.ReadAllBytes(path, Rules(display, MaxArrowBytes)), m, display);
        if (!string.Equals(GoldenFrameText.ContentHash(table), frame.Sha256, StringComparison.Ordinal))
            throw new EngineException(ErrorCodes.Golden, "the Arrow data does not match the sha256 in its frame file", display, 0, 0);
    }

    private static string ModesText(IReadOnlyList<ModeRun> runs)
    {
        var names = new string[runs.Count];
        for (var i = 0; i < names.Length; i++) names[i] = runs[i].Mode.Name;
        return string.Join(",", names);
    }

    /// <summary>Line endings as written (a checkout that turned them into CRLF still compares equal).</summary>
    private static string Normalize(string text) => text.Replace("\r\n", "\n", StringComparison.Ordinal);

    /// <summary>A short line diff around the first differing line: one line of context, then up to three lines each side.</summary>
    public static string Excerpt(string expected, string actual)
    {
        var e = expected.Split('\n');
        var a = actual.Split('\n');
        var i = 0;
        while (i < e.Length && i < a.Length && string.Equals(e[i], a[i], StringComparison.Ordinal)) i++;
        var sb = new StringBuilder();
        sb.Append("@@ line ").Append((i + 1).ToString(System.Globalization.CultureInfo.InvariantCulture)).Append(" @@\n");
        if (i > 0) sb.Append("  ").Append(e[i - 1]).Append('\n');
        for (var k = i; k < Math.Min(e.Length, i + 3); k++)
            if (k < e.Length - 1 || e[k].Length > 0) sb.Append("- ").Append(e[k]).Append('\n');
        for (var k = i; k < Math.Min(a.Length, i + 3); k++)
            if (k < a.Length - 1 || a[k].Length > 0) sb.Append("+ ").Append(a[k]).Append('\n');
        return sb.ToString();
    }

    // ---- accepted findings ------------------------------------------------------------------------

    /// <summary>
    /// Marks each current finding new, accepted or changed against <paramref name="accepted"/> and adds a
    /// resolved finding (count 0) for each accepted one that is gone. Null means no golden store: all new.
    /// A finding is accepted when its key is accepted with the same total count and the same later checkpoints
    /// (<see cref="Finding.AlsoAt"/>); it is changed when its key is accepted with another count or footprint,
    /// or when an accepted group of the same kind, column and difference covered one of its checkpoints.
    /// Version 1 entries (keyed by line) are matched by kind, checkpoint or line, and column; a group matches
    /// when every checkpoint it covers was accepted, with the counts summed.
    /// </summary>
    public static IReadOnlyList<Finding> ApplyAccepted(IReadOnlyList<Finding> current, IReadOnlyList<AcceptedFinding>? accepted, string script)
    {
        if (accepted is null)
        {
            var all = new List<Finding>(current.Count);
            foreach (var f in current) all.Add(f with { Status = FindingStatus.New });
            return all;
        }
        var byId = new Dictionary<string, AcceptedFinding>(StringComparer.Ordinal);
        foreach (var a in accepted) byId.TryAdd(a.Identity, a);
        var used = new HashSet<string>(StringComparer.Ordinal);
        var result = new List<Finding>(current.Count + accepted.Count);
        foreach (var f in current)
        {
            var id = FindingIdentity.Of(f);
            if (byId.TryGetValue(id, out var a) && a.Version != 1 && used.Add(id))
            {
                var same = a.Count == f.Count && SameLabels(a.AlsoAt, f.AlsoAt);
                result.Add(f with { Status = same ? FindingStatus.Accepted : FindingStatus.Changed, AcceptedCount = a.Count });
                continue;
            }
            var moved = FindMovedGroup(f, accepted, used);
            if (moved is not null)
            {
                used.Add(moved.Identity);
                result.Add(f with { Status = FindingStatus.Changed, AcceptedCount = moved.Count });
                continue;
            }
            var (found, missing, count) = MatchVersion1(f, byId, used);
            if (found > 0)
                result.Add(f with { Status = missing == 0 && count == f.Count ? FindingStatus.Accepted : FindingStatus.Changed, AcceptedCount = (int)Math.Min(count, int.MaxValue) });
            else
                result.Add(f with { Status = FindingStatus.New });
        }
        foreach (var a in accepted)
        {
            if (used.Contains(a.Identity)) continue;
            used.Add(a.Identity);
            result.Add(new Finding
            {
                Kind = ParseKind(a.Kind),
                Script = script,
                Line = a.Line,
                Checkpoint = a.Checkpoint,
                Statement = a.Checkpoint is null ? a.Statement : null,
                Column = a.Column,
                Difference = a.Difference,
                AlsoAt = a.AlsoAt,
                CausedBy = a.CausedBy,
                Count = 0,
                AcceptedCount = a.Count,
                Status = FindingStatus.Resolved,
                Message = a.Message,
                Hint = "resolved: `parity accept` drops it from the accepted set",
                Modes = a.Modes,
            });
        }
        result.Sort(Diffing.FindingOrder.Instance);
        return result;
    }

    private static bool SameLabels(IReadOnlyList<string> a, IReadOnlyList<string> b)
    {
        if (a.Count != b.Count) return false;
        for (var i = 0; i < a.Count; i++)
            if (!string.Equals(a[i], b[i], StringComparison.Ordinal)) return false;
        return true;
    }

    /// <summary>An accepted group of the same kind, column, difference and modes that covered one of <paramref name="f"/>'s checkpoints (its first checkpoint moved).</summary>
    private static AcceptedFinding? FindMovedGroup(Finding f, IReadOnlyList<AcceptedFinding> accepted, HashSet<string> used)
    {
        if (f.Checkpoint is null) return null;
        var mine = new HashSet<string>(f.AlsoAt, StringComparer.Ordinal) { f.Checkpoint };
        foreach (var a in accepted)
        {
            if (a.Version == 1 || a.Checkpoint is null || used.Contains(a.Identity)) continue;
            if (!string.Equals(a.Kind, f.KindLabel, StringComparison.Ordinal) || !string.Equals(a.Column, f.Column, StringComparison.Ordinal)
                || !string.Equals(a.Difference, f.Difference, StringComparison.Ordinal) || !SameLabels(a.Modes, f.Modes))
                continue;
            if (mine.Contains(a.Checkpoint)) return a;
            foreach (var l in a.AlsoAt)
                if (mine.Contains(l)) return a;
        }
        return null;
    }

    /// <summary>Version 1 entries for <paramref name="f"/>: one per checkpoint it covers (or its line); how many were found and missing, and their summed count.</summary>
    private static (int Found, int Missing, long Count) MatchVersion1(Finding f, Dictionary<string, AcceptedFinding> byId, HashSet<string> used)
    {
        var ids = new List<string>();
        if (f.Checkpoint is null) ids.Add(FindingIdentity.OfVersion1(f.KindLabel, f.Line, null, f.Column, f.Modes));
        else
        {
            ids.Add(FindingIdentity.OfVersion1(f.KindLabel, f.Line, f.Checkpoint, f.Column, f.Modes));
            foreach (var l in f.AlsoAt) ids.Add(FindingIdentity.OfVersion1(f.KindLabel, 0, l, f.Column, f.Modes));
        }
        int found = 0, missing = 0;
        long count = 0;
        foreach (var id in ids)
        {
            if (byId.TryGetValue(id, out var a) && a.Version == 1 && !used.Contains(id))
            {
                used.Add(id);
                found++;
                count += a.Count;
            }
            else missing++;
        }
        return (found, missing, count);
    }

    private static FindingKind ParseKind(string label)
    {
        foreach (var k in Enum.GetValues<FindingKind>())
            if (string.Equals(k.ToString().ToLowerInvariant(), label, StringComparison.Ordinal)) return k;
        return FindingKind.Value;
    }
}
