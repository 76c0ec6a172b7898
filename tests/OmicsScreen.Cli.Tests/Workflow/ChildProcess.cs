using System.Diagnostics;
using System.Text;

namespace OmicsScreen.Cli.Tests.Workflow;

/// <summary>
/// Runs a program as a real child process, as a shell or a scheduler would, and kills it with all
/// its children when it outlives its deadline, so a hung job cannot hang the test run.
/// </summary>
internal static class ChildProcess
{
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
