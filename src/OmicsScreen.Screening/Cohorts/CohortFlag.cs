namespace OmicsScreen.Screening.Cohorts;

/// <summary>What the cohort check says about a marker.</summary>
public enum CohortFlag
{
    None,
    /// <summary>Differs between cohorts but not between classes within them: the signal is explained by cohort.</summary>
    CohortArtefact,
    /// <summary>
    /// The within-cohort effect varies between cohorts more than chance allows: Cochran's Q test
    /// significant after Benjamini-Hochberg across features, and within-cohort AUCs 0.10 or more apart.
    /// </summary>
    Heterogeneous,
}
