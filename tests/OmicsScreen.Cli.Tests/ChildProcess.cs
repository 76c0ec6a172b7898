using System.Diagnostics;
using System.Text;
using OmicsScreen.Cli.Tests.Work;

namespace OmicsScreen.Cli.Tests;

/// <summary>
/// Programs as real child processes: the command-line program started so a test can kill it as
/// the system would (<see cref="Start(IEnumerable{string})"/>), or any program run to its end as a
/// shell or a scheduler would, killed with all its children when it outlives its deadline
/// (<see cref="Run"/>), so a hung job cannot hang the test run.
/// </summary>
internal static class ChildProcess
{
    public static Process Start(IEnumerable<string> args) => Start(args, null);

    /// <summary>Starts the program and keeps what it writes on standard error.</summary>
    public static CapturedProcess StartCapturing(IEnumerable<string> args)
    {
        var error = new StringBuilder();
        return new CapturedProcess(Start(args, error), error);
    }

    private static Process Start(IEnumerable<string> args, StringBuilder? error)
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

    public sealed record Outcome(int ExitCode, string Output)
    {
        public bool Succeeded => ExitCode == 0;
    }

    /// <param name="deadline">The moment the process is killed if it is still running.</param>
    public static Outcome Run(string program, IEnumerable<string> arguments, string workingDirectory, DateTime deadline,
        IReadOnlyDictionary<string, string>? environment = null)
    {
        var start = new ProcessStartInfo(program)
        {
            WorkingDirectory = workingDirectory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            StandardOutputEncoding = Encoding.UTF8,
            StandardErrorEncoding = Encoding.UTF8,
            UseShellExecute = false,
        };
        foreach (var argument in arguments) start.ArgumentList.Add(argument);
        if (environment is not null)
            foreach (var (name, value) in environment) start.Environment[name] = value;

        // Standard output and error go to one buffer in arrival order, as a terminal shows them.
        var output = new StringBuilder();
        using var process = new Process { StartInfo = start };
        process.OutputDataReceived += (_, line) => { if (line.Data is not null) lock (output) output.AppendLine(line.Data); };
        process.ErrorDataReceived += (_, line) => { if (line.Data is not null) lock (output) output.AppendLine(line.Data); };
        process.Start();
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();

        var remaining = deadline - DateTime.UtcNow;
        if (remaining < TimeSpan.Zero) remaining = TimeSpan.Zero;
        if (!process.WaitForExit(remaining))
        {
            process.Kill(entireProcessTree: true);
            process.WaitForExit();
            throw new TimeoutException($"{program} {string.Join(' ', start.ArgumentList)} was killed at its deadline.\n{output}");
        }
        process.WaitForExit(); // drains the redirected streams
        lock (output) return new Outcome(process.ExitCode, output.ToString());
    }
}
