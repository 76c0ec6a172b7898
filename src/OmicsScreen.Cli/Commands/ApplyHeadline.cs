using OmicsScreen.Runs.Results;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Cli.Commands;

/// <summary>What `apply --json` prints on standard output: the headline of a locked panel applied to a cohort.</summary>
public sealed record ApplyHeadline
{
    public required string ResultsFolder { get; init; }
    public required string Report { get; init; }
    public required int Samples { get; init; }
    public required IReadOnlyList<string> Markers { get; init; }

    /// <summary>The markers' lab-facing names by id, as the locked panel recorded them; empty when the discovery inputs named none.</summary>
    public required IReadOnlyDictionary<string, string> MarkerDisplayNames { get; init; }
    public required IReadOnlyDictionary<string, int> Called { get; init; }
    public required string PositiveClass { get; init; }
    public required double? Threshold { get; init; }
    public required double? Auc { get; init; }
    public required double? AucLow95 { get; init; }
    public required double? AucHigh95 { get; init; }
    public required double? Error { get; init; }
    public required double? DiscoveryOutOfBagAuc { get; init; }
    public required IReadOnlyList<string> Warnings { get; init; }

    public static ApplyHeadline Of(LockedPanel model, LockedPanelScores scores, LockedPanelPerformance? performance, string folder,
        IReadOnlyList<string> discoveryOverlap, IReadOnlyDictionary<string, string> displayNames)
    {
        var called = new SortedDictionary<string, int>(StringComparer.Ordinal);
        foreach (var name in scores.ClassNames) called[name] = 0;
        foreach (int c in scores.PredictedClasses) called[scores.ClassNames[c]]++;
        return new ApplyHeadline
        {
            ResultsFolder = folder,
            Report = Path.Combine(folder, ApplyResultFiles.Report),
            Samples = scores.SampleCount,
            Markers = model.MarkerNames,
            MarkerDisplayNames = displayNames,
            Called = called,
            PositiveClass = model.ClassNames[model.PositiveClass],
            Threshold = model.Threshold,
            Auc = performance?.Auc,
            AucLow95 = performance?.AucInterval?.Lower,
            AucHigh95 = performance?.AucInterval?.Upper,
            Error = performance?.Error,
            DiscoveryOutOfBagAuc = model.OutOfBagAuc,
            Warnings = [.. discoveryOverlap, .. scores.Warnings.Select(w => w.Message)],
        };
    }
}
