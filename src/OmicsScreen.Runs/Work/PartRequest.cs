using OmicsScreen.Data;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Runs.Work;

/// <summary>What one part of a split screen is asked to do (`screen --part I/N --out FOLDER`).</summary>
public sealed record PartRequest
{
    /// <summary>How the panel was loaded; recorded so the merge can load it again.</summary>
    public required PanelLoadOptions Panel { get; init; }
    public required ScreenOptions Screen { get; init; }
    public required RunPart Part { get; init; }

    /// <summary>The part folder as the user named it (messages show it so).</summary>
    public required string Folder { get; init; }
    public bool Resume { get; init; }
    public bool Force { get; init; }
    public bool ShowSampleIds { get; init; }

    /// <summary>The command as typed, recorded so the merge can name the single run it equals.</summary>
    public IReadOnlyList<string> CommandLine { get; init; } = [];
}
