using OmicsScreen.Data;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Results;

/// <summary>What a screen was asked to do, as its results folder records it (manifest, report, warnings).</summary>
public sealed record ScreenResultsRequest
{
    /// <summary>How the panel was loaded: its files, layout, feature block or list.</summary>
    public required PanelLoadOptions Panel { get; init; }
    public required ScreenOptions Screen { get; init; }

    /// <summary>Let sample identifiers into the HTML report (--show-sample-ids).</summary>
    public bool ShowSampleIds { get; init; }

    /// <summary>The command line as typed (for a merge, the single run it equals), recorded so the run can be repeated.</summary>
    public IReadOnlyList<string> CommandLine { get; init; } = [];
}
