using System.Diagnostics;

namespace OmicsScreen.Cli.Tests.Work;

/// <summary>The command-line program as a real process of its own, so a test can kill it as the system would.</summary>
internal static class ChildProcess
{
    public static Process Start(IEnumerable<string> args)
    {
        string dotnet = Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } host ? host : "dotnet";
        var info = new ProcessStartInfo(dotnet)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "omicsscreen.dll"));
        foreach (var arg in args) info.ArgumentList.Add(arg);
        var process = Process.Start(info) ?? throw new InvalidOperationException("The program did not start.");
        // Drain both streams so a full pipe never stalls the child.
        process.OutputDataReceived += (_, _) => { };
        process.ErrorDataReceived += (_, _) => { };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return process;
    }
}
