using System.CommandLine;
using OmicsScreen.Cli.Help;

namespace OmicsScreen.Cli;

/// <summary>The `omicsscreen` command itself: its verbs, and examples of the usual order of work.</summary>
public sealed class OmicsScreenRootCommand : RootCommand, IHelpLayout
{
    public OmicsScreenRootCommand(string description) : base(description)
    {
    }

    public IReadOnlyList<HelpSection> HelpSections => [];

    public IReadOnlyList<HelpExample> Examples =>
    [
        new("Check a panel, then screen it", "omicsscreen check plasma.csv --samples sheet.tsv --outcome status"),
        new("Screen it; the results folder holds the tables, report.html and the locked panel",
            "omicsscreen screen plasma.csv --samples sheet.tsv --outcome status --out reports/plasma"),
        new("Score a validation cohort with the locked panel",
            "omicsscreen apply reports/plasma/locked_panel.json validation.csv --samples validation_sheet.tsv --outcome status --out reports/validation"),
    ];
}
