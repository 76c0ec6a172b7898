using OmicsScreen.Cli.Console;

namespace OmicsScreen.Cli.Tests;

/// <summary>Runs the command line in-process with captured output, as a user's shell would see it.</summary>
internal static class CliHarness
{
    public sealed record Outcome(int ExitCode, string Out, string Error);

    public static Outcome Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CommandLine.Run(args, new CliConsole(output, error, isTerminal: false));
        return new Outcome(code, output.ToString(), error.ToString());
    }
}
