using System.Diagnostics;

namespace OmicsScreen.Cli.Tests.Work;

/// <summary>The command-line program as a real process of its own, so a test can kill it as the system would.</summary>
internal static class ChildProcess
{
    public static Process Start(IEnumerable<string> args) => Start(args, null);

    /// <summary>Starts the program and keeps what it writes on standard error.</summary>
    public static CapturedProcess StartCapturing(IEnumerable<string> args)
    {
        var error = new System.Text.StringBuilder();
        return new CapturedProcess(Start(args, error), error);
    }

    private static Process Start(IEnumerable<string> args, System.Text.StringBuilder? error)
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
        process.ErrorDataReceived += (_, line) =>
        {
            if (error is not null && line.Data is not null) lock (error) error.AppendLine(line.Data);
        };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return process;
    }
}
