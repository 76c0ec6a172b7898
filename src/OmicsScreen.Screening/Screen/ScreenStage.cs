namespace OmicsScreen.Screening.Screen;

/// <summary>The stages of a screen, in the order they run.</summary>
public enum ScreenStage
{
    Binning,
    UnivariateStatistics,
    ReferenceForest,
    Repeats,
    OutcomePermutations,
    PanelSizeCurve,
    Cohorts,

    /// <summary>The work units of one part of a split run.</summary>
    WorkUnits,
}
