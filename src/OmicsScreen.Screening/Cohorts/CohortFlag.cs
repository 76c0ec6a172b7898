namespace OmicsScreen.Screening.Cohorts;

/// <summary>What the cohort check says about a marker.</summary>
public enum CohortFlag
{
    None,
    /// <summary>Differs between cohorts but has no consistent effect on the outcome within them: the signal is explained by cohort.</summary>
    CohortArtefact,
    /// <summary>
    /// The within-cohort effect varies between cohorts more than chance allows: Cochran's Q test
    /// significant after Benjamini-Hochberg across features, and within-cohort effects at least
    /// the measure's minimum spread apart (<see cref="CohortEffectScale.MinimumSpread"/>).
    /// </summary>
    Heterogeneous,
}
