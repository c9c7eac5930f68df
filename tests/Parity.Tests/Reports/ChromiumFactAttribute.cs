namespace Parity.Tests.Reports;

/// <summary>
/// A fact that needs headless Chromium. Skipped, with the reason, when no browser is installed and the
/// <c>CI</c> environment variable is not set; under CI it always runs (CI installs the browser), so a
/// missing browser there fails instead of passing silently.
/// </summary>
public sealed class ChromiumFactAttribute : FactAttribute
{
    public ChromiumFactAttribute()
    {
        if (Chromium.Executable is null && string.IsNullOrEmpty(Environment.GetEnvironmentVariable("CI")))
            Skip = "headless Chromium not found (install the 'chromium' package, or set PARITY_CHROMIUM to its path); set CI to require it";
    }
}
