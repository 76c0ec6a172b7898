using OmicsScreen.Runs.Apply;

namespace OmicsScreen.Cli.Commands;

/// <summary>
/// What `apply --json` prints on standard output for every outcome kind: where the results are,
/// how many samples were scored with which markers, and the warnings. Each kind's headline adds
/// its own figures; the JSON lists every property in the order of its name.
/// </summary>
public abstract record ApplyHeadline
{
    protected ApplyHeadline(AppliedPanel applied)
    {
        ResultsFolder = applied.Folder;
        Report = applied.Report;
        Samples = applied.SampleCount;
        Markers = applied.Markers;
        MarkerDisplayNames = applied.DisplayNames;
        Warnings = applied.Warnings;
    }

    public string ResultsFolder { get; }
    public string Report { get; }
    public int Samples { get; }
    public IReadOnlyList<string> Markers { get; }

    /// <summary>The markers' lab-facing names by id, as the locked panel recorded them; empty when the discovery inputs named none.</summary>
    public IReadOnlyDictionary<string, string> MarkerDisplayNames { get; }

    /// <summary>The discovery overlap first, then the scale checks.</summary>
    public IReadOnlyList<string> Warnings { get; }
}
