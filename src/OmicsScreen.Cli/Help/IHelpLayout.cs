namespace OmicsScreen.Cli.Help;

/// <summary>A command whose help groups its options in sections and ends with worked examples.</summary>
public interface IHelpLayout
{
    IReadOnlyList<HelpSection> HelpSections { get; }

    /// <summary>Whole command lines, each with a line saying what it does.</summary>
    IReadOnlyList<HelpExample> Examples { get; }
}
