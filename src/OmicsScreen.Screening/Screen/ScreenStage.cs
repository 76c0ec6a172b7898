namespace OmicsScreen.Screening.Screen;

/// <summary>The stages of a screen, in the order they run.</summary>
public enum ScreenStage
{
    Binning,
    UnivariateStatistics,
    ReferenceForest,
    Repeats,
    OutcomePermutations,

    /// <summary>Effect shapes and interaction partners of the shortlisted markers.</summary>
    Effects,
    PanelSizeCurve,
    Cohorts,

    /// <summary>The work units of one part of a split run.</summary>
    WorkUnits,
}
