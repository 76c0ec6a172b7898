using System.CommandLine;

namespace OmicsScreen.Cli;

/// <summary>Builds the root command with one sub-command per verb and runs it.</summary>
public static class CommandLine
{
    public static RootCommand BuildRoot()
    {
        var root = new RootCommand("OmicsScreen: screen a discovery omics panel for markers worth validating.");
        return root;
    }

    public static int Run(string[] args) => BuildRoot().Parse(args).Invoke();
}
