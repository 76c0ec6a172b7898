using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Apply;

/// <summary>
/// What `apply` did, whatever the locked panel's outcome kind: where the results went, and the
/// warnings a reader must see. Each kind's record adds its panel, scores and performance.
/// </summary>
/// <param name="Folder">The results folder's full path.</param>
/// <param name="DiscoveryOverlap">Warnings that the cohort shares a file or samples with the discovery data.</param>
/// <param name="DisplayNames">The markers' lab-facing names by id, as the locked panel recorded them.</param>
public abstract record AppliedPanel(string Folder, IReadOnlyList<string> DiscoveryOverlap, IReadOnlyDictionary<string, string> DisplayNames)
{
    public string Report => Path.Combine(Folder, ApplyResultFiles.Report);

    public abstract int SampleCount { get; }

    public abstract IReadOnlyList<string> Markers { get; }

    /// <summary>Markers measured in no sample, or apparently on another scale than in discovery.</summary>
    public abstract IReadOnlyList<ScaleWarning> ScaleWarnings { get; }

    /// <summary>Every warning, the discovery overlap first, as the JSON headline lists them.</summary>
    public IReadOnlyList<string> Warnings => [.. DiscoveryOverlap, .. ScaleWarnings.Select(w => w.Message)];
}
