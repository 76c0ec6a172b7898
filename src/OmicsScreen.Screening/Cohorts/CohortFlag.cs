namespace OmicsScreen.Screening.Cohorts;

/// <summary>What the cohort check says about a marker.</summary>
public enum CohortFlag
{
    None,
    /// <summary>Differs between cohorts but not between classes within them: the signal is explained by cohort.</summary>
    CohortArtefact,
    /// <summary>The within-cohort effect varies between cohorts far more than chance allows (I^2 at or above 0.75).</summary>
    Heterogeneous,
}
