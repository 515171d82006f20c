using System.Diagnostics;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// Runs Debian's headless Chromium (installed by .ci/install-system-packages) as a separate process:
/// <c>--dump-dom</c> for the parsed document and <c>--screenshot</c> for pixels. Console messages of the page are
/// read from its log on standard error (<c>--enable-logging=stderr --v=0</c> prints them as <c>CONSOLE</c> lines).
/// </summary>
internal static class Chromium
{
    /// <summary>The browser executable, or null when none is installed.</summary>
    public static string? Executable { get; } = Find();

    /// <summary>True when the CI environment variable is set: the browser tests must then run, never skip.</summary>
    public static bool InCi => !string.IsNullOrEmpty(Environment.GetEnvironmentVariable("CI"));

    private static string? Find()
    {
        // NETADJUST_CHROMIUM names the browser to use; a path that does not exist means "no browser" (to check the skip
        // rule).
        string? env = Environment.GetEnvironmentVariable("NETADJUST_CHROMIUM");
        if (!string.IsNullOrEmpty(env)) return File.Exists(env) ? env : null;
        foreach (var dir in (Environment.GetEnvironmentVariable("PATH") ??
            "").Split(Path.PathSeparator).Append("/usr/bin"))
            foreach (var name in new[] { "chromium", "chromium-browser" })
            {
                if (dir.Length == 0) continue;
                string p = Path.Combine(dir, name);
                if (File.Exists(p)) return p;
            }
        return null;
    }

    public sealed record Run(int ExitCode, string Stdout, string Stderr)
    {
        /// <summary>Console messages the page produced (errors, warnings, logs, CSP violations).</summary>
        public IReadOnlyList<string> ConsoleMessages =>
            Stderr.Split('\n').Where(l => l.Contains(":CONSOLE", StringComparison.Ordinal) ||
                l.Contains("CONSOLE(", StringComparison.Ordinal)).ToList();
    }

    /// <summary>Runs the browser headless on a local file with extra arguments (e.g. --dump-dom).</summary>
    public static Run Open(string file, params string[] extra)
    {
        string exe = Executable ?? throw new InvalidOperationException(
            "chromium is not installed, and the browser tests must run here (CI is set): install it with " +
                ".ci/install-system-packages");
        string profile = Directory.CreateTempSubdirectory("netadjust-chromium-").FullName;
        try
        {
            var psi = new ProcessStartInfo(exe) { RedirectStandardOutput = true, RedirectStandardError = true,
                UseShellExecute = false };
            foreach (var a in new[] { "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking",
                "--disable-component-update",
                                      "--disable-sync", "--no-first-run", "--disable-extensions", "--hide-scrollbars",
                                          "--enable-logging=stderr", "--v=0",
                                      "--user-data-dir=" + profile })
                psi.ArgumentList.Add(a);
            foreach (var a in extra) psi.ArgumentList.Add(a);
            psi.ArgumentList.Add(new Uri(Path.GetFullPath(file)).AbsoluteUri);
            using var p = Process.Start(psi)!;
            var stdout = p.StandardOutput.ReadToEndAsync();
            var stderr = p.StandardError.ReadToEndAsync();
            if (!p.WaitForExit(TimeSpan.FromSeconds(120)))
            {
                p.Kill(entireProcessTree: true);
                throw new TimeoutException($"chromium did not finish within 120 s on {file}");
            }
            p.WaitForExit();
            return new Run(p.ExitCode, stdout.Result, stderr.Result);
        }
        finally
        {
            try { Directory.Delete(profile,
                recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
        }
    }
}

/// <summary>
/// A fact that needs the browser: skipped with a clear message only when chromium is absent AND the CI
/// environment variable is not set. Under CI it always runs, so a missing browser fails the build.
/// </summary>
public sealed class ChromiumFactAttribute : FactAttribute
{
    /// <summary>Sets the skip reason when the browser is missing outside CI.</summary>
    public ChromiumFactAttribute()
    {
        if (Chromium.Executable is null && !Chromium.InCi)
            Skip =
                "chromium is not installed (apt-get install chromium, or run .ci/install-system-packages); browser " +
                "tests skipped locally. CI runs them.";
    }
}
