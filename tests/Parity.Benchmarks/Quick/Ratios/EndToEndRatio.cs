using Parity.Cli;
using Parity.Engine.IO;
using Parity.Engine.Modes;
using Parity.Harness.Fixtures;

namespace Parity.Benchmarks.Quick.Ratios;

/// <summary>
/// The demo fixtures scaled to 1,000,000 tickets: loading the three files in both presets (the loader's
/// cache cleared first) over <c>parity run</c> of the demo script that loads all three, in both presets
/// with every report (md, json, junit, html), in process through <see cref="CliApp.Run"/>. The run includes
/// its own loads, so the ratio shows what the interpreter, differ and reports add on top of loading.
/// </summary>
public sealed class EndToEndRatio : Ratio
{
    private const int Tickets = 1_000_000;
    private const string Script = "routes_report.parity";
    private string _dir = "";
    private string[] _files = [];

    public override string Name => "e2e.load_over_run";

    public override double Target => 0.25;

    public override string Description => "load ms / run ms";

    public override int Repetitions => 3;

    public override void Setup()
    {
        _dir = Path.Combine(Path.GetTempPath(), "parity-quick-e2e");
        var harbor = Path.Combine(_dir, "harbor");
        var scripts = Path.Combine(_dir, "scripts");
        Directory.CreateDirectory(scripts);
        if (!File.Exists(Path.Combine(harbor, "tickets.csv")) || new FileInfo(Path.Combine(harbor, "tickets.csv")).Length < 10_000_000)
            new HarborLineGenerator(1).Write(harbor, Tickets);
        File.Copy(Path.Combine(RepoFixtures(), "scripts", Script), Path.Combine(scripts, Script), overwrite: true);
        _files = [Path.Combine(harbor, "tickets.csv"), Path.Combine(harbor, "sailings.parquet"), Path.Combine(harbor, "routes.arrow")];
    }

    /// <summary>The repository's <c>fixtures</c> folder, found upwards from the benchmark binary.</summary>
    private static string RepoFixtures()
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
        {
            var f = Path.Combine(d.FullName, "fixtures", "scripts");
            if (Directory.Exists(f)) return Path.Combine(d.FullName, "fixtures");
        }
        throw new DirectoryNotFoundException("fixtures/scripts not found above " + AppContext.BaseDirectory);
    }

    public override void Verify()
    {
        var code = RunOnce();
        if (code == 2) throw new InvalidOperationException("e2e: parity run reported bad input");
        if (Directory.GetFiles(Path.Combine(_dir, "out")).Length < 4) throw new InvalidOperationException("e2e: reports missing");
    }

    public override void Numerator()
    {
        DataLoader.ClearCache();
        foreach (var mode in new[] { Mode.Legacy, Mode.Modern })
            foreach (var f in _files) DataLoader.Load(f, LoadOptions.Default, mode);
    }

    public override void Denominator() => RunOnce();

    private int RunOnce()
    {
        DataLoader.ClearCache();
        var context = new CliContext(TextWriter.Null, TextWriter.Null, _dir);
        return CliApp.Run(["run", Path.Combine("scripts", Script), "--out", "out", "--format", "md,json,junit,html"], context);
    }
}
