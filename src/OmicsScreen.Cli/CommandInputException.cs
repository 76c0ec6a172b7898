namespace OmicsScreen.Cli;

/// <summary>A problem with what the user asked for (values of options, folders), not with a file's content.</summary>
public sealed class CommandInputException : Exception
{
    public CommandInputException(string message, int exitCode = Cli.ExitCode.Usage) : base(message) => Code = exitCode;

    public int Code { get; }
}
