using System.Diagnostics;
using System.Text;

namespace OmicsScreen.Cli.Tests.Work;

/// <summary>A child process of the program whose standard error is kept for the test to read.</summary>
internal sealed class CapturedProcess : IDisposable
{
    private readonly StringBuilder _error;

    public CapturedProcess(Process process, StringBuilder error)
    {
        Process = process;
        _error = error;
    }

    public Process Process { get; }

    /// <summary>Standard error so far (all of it once the process has exited and <see cref="Process"/>.WaitForExit() has returned).</summary>
    public string Error
    {
        get
        {
            lock (_error) return _error.ToString();
        }
    }

    /// <summary>Kills the process if a failed test left it running.</summary>
    public void Dispose()
    {
        if (!Process.HasExited) Process.Kill(entireProcessTree: true);
        Process.Dispose();
    }
}
