using System.CommandLine;
using System.CommandLine.Invocation;

namespace OmicsScreen.Cli.Help;

/// <summary>Prints the help of the command the user asked about, in sections with value names and examples.</summary>
internal sealed class SectionedHelpAction : SynchronousCommandLineAction
{
    private readonly TextWriter _output;

    public SectionedHelpAction(TextWriter output) => _output = output;

    public override int Invoke(ParseResult parseResult)
    {
        _output.Write(HelpText.For(parseResult.CommandResult.Command));
        return ExitCode.Success;
    }
}
