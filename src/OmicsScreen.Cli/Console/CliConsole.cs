namespace OmicsScreen.Cli.Console;

/// <summary>
/// Where a command writes: results and tables to <see cref="Out"/>, messages and errors to
/// <see cref="Error"/>. Tests pass string writers; the program passes the process streams.
/// </summary>
public sealed class CliConsole
{
    public CliConsole(TextWriter output, TextWriter error, bool isTerminal)
    {
        Out = output;
        Error = error;
        IsTerminal = isTerminal;
    }

    public TextWriter Out { get; }
    public TextWriter Error { get; }

    /// <summary>True when standard error is an interactive terminal, so progress may redraw a line.</summary>
    public bool IsTerminal { get; }

    public static CliConsole FromProcess() =>
        new(System.Console.Out, System.Console.Error, !System.Console.IsErrorRedirected);
}
