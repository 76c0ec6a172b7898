using System.CommandLine;

namespace OmicsScreen.Cli.Help;

/// <summary>A titled group of a command's options in its help (input, forest, run, ...).</summary>
public sealed record HelpSection(string Title, IReadOnlyList<Option> Options);
