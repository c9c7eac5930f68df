using System.Diagnostics;

namespace Parity.Tests.Reports;

/// <summary>Runs headless Chromium on a local file and returns the DOM after its scripts ran.</summary>
internal static class Chromium
{
    public static string? Executable { get; } = Find();

    public static string DumpDom(string file, string fragment = "")
    {
        var exe = Executable ?? throw new InvalidOperationException("CI is set but Chromium is not installed (apt-get install chromium)");
        var profile = Path.Combine(Path.GetTempPath(), "parity-chromium-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(profile);
        try
        {
            var start = new ProcessStartInfo(exe)
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                UseShellExecute = false,
            };
            foreach (var arg in new[]
            {
                "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--user-data-dir=" + profile, "--dump-dom", new Uri(Path.GetFullPath(file)).AbsoluteUri + fragment,
            })
                start.ArgumentList.Add(arg);
            using var process = Process.Start(start) ?? throw new InvalidOperationException("could not start " + exe);
            var stderr = process.StandardError.ReadToEndAsync();
            var dom = process.StandardOutput.ReadToEnd();
            // A guard against a hung browser, not a speed check.
            if (!process.WaitForExit(120_000))
            {
                process.Kill(entireProcessTree: true);
                throw new TimeoutException("chromium did not finish");
            }
            if (dom.Length == 0)
                throw new InvalidOperationException("chromium printed no DOM (exit " + process.ExitCode + "): " + stderr.Result);
            return dom;
        }
        finally
        {
            try { Directory.Delete(profile, recursive: true); }
            catch (IOException) { }
            catch (UnauthorizedAccessException) { }
        }
    }

    private static string? Find()
    {
        var configured = Environment.GetEnvironmentVariable("PARITY_CHROMIUM");
        if (!string.IsNullOrEmpty(configured) && File.Exists(configured)) return configured;
        var path = Environment.GetEnvironmentVariable("PATH") ?? "";
        foreach (var dir in path.Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
            foreach (var name in new[] { "chromium", "chromium-browser", "google-chrome", "google-chrome-stable" })
            {
                var candidate = Path.Combine(dir, name);
                if (File.Exists(candidate)) return candidate;
            }
        return null;
    }
}
