namespace OmicsScreen.Screening.Work;

/// <summary>The kinds of independent work a screen is made of; the numbers are part of the unit file format.</summary>
public enum WorkUnitKind
{
    /// <summary>One half-sample repeat of the main screen: two forests and their importances.</summary>
    Repeat = 1,

    /// <summary>The inner screen of one outer fold of the panel-size curve.</summary>
    CurveFold = 2,

    /// <summary>The screen of one cohort on its own samples.</summary>
    CohortScreen = 3,

    /// <summary>The screen of all cohorts but one, for leave-one-cohort-out validation.</summary>
    HeldOutScreen = 4,
}
