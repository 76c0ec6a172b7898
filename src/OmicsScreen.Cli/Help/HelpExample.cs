namespace OmicsScreen.Cli.Help;

/// <summary>A command line shown in the help, with what it does.</summary>
public sealed record HelpExample(string Purpose, string CommandLine);
