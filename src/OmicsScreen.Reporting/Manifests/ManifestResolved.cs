using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Reporting.Manifests;

/// <summary>Settings the screen resolved on the panel itself, beside the parameters as given.</summary>
public sealed record ManifestResolved
{
    public required bool ClassBalanced { get; init; }

    /// <summary>parameters.features_per_split is the clean forests' value; the wider forests resolve on their own width.</summary>
    public required int FeaturesPerSplitCorrectedForest { get; init; }

    /// <summary>Null when no outcome-permutation forest was grown.</summary>
    public int? FeaturesPerSplitOutcomePermutationForest { get; init; }

    public required double MeanSelectedPerRepeat { get; init; }
    public required int Repeats { get; init; }

    public static ManifestResolved Of(ScreenResult result)
    {
        var settings = result.Settings;
        return new ManifestResolved
        {
            ClassBalanced = settings.ClassBalanced,
            FeaturesPerSplitCorrectedForest = settings.CorrectedForestFeaturesPerSplit,
            FeaturesPerSplitOutcomePermutationForest = settings.OutcomePermutationForestFeaturesPerSplit > 0
                ? settings.OutcomePermutationForestFeaturesPerSplit : null,
            MeanSelectedPerRepeat = result.Stability.MeanSelectedPerRepeat,
            Repeats = settings.RepeatCount,
        };
    }
}
