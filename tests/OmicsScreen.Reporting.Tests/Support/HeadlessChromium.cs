using System.Diagnostics;
using System.Text;

namespace OmicsScreen.Reporting.Tests.Support;

/// <summary>
/// Runs Debian's Chromium headless on a local file with every network path closed: host names
/// resolve nowhere and any connection would go to a proxy on the discard port.
/// </summary>
internal static class HeadlessChromium
{
    public const string Executable = "/usr/bin/chromium";

    // Generous: on a shared 2-core machine at load 50 one page took over 40 s; a quiet machine needs 1-3 s.
    private static readonly TimeSpan Timeout = TimeSpan.FromSeconds(180);

    /// <summary>Runs Chromium with the isolation flags plus <paramref name="arguments"/>; returns standard output.</summary>
    public static string Run(string profileDirectory, params string[] arguments)
    {
        var start = new ProcessStartInfo(Executable)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            StandardOutputEncoding = Encoding.UTF8,
            UseShellExecute = false,
        };
        string[] isolation =
        [
            "--headless", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage", "--no-first-run",
            "--disable-extensions", "--disable-background-networking", "--disable-component-update", "--disable-sync",
            "--disable-default-apps", "--hide-scrollbars", "--host-resolver-rules=MAP * ~NOTFOUND",
            "--proxy-server=http://127.0.0.1:9", "--user-data-dir=" + profileDirectory,
        ];
        foreach (var argument in isolation) start.ArgumentList.Add(argument);
        foreach (var argument in arguments) start.ArgumentList.Add(argument);

        using var process = Process.Start(start) ?? throw new InvalidOperationException("Chromium did not start.");
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(Timeout))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"Chromium did not finish within {Timeout.TotalSeconds} s.");
        }
        process.WaitForExit();
        if (process.ExitCode != 0) throw new InvalidOperationException($"Chromium exited with {process.ExitCode}: {error.Result}");
        return output.Result;
    }
}
