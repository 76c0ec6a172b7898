using OmicsScreen.Screening.Cohorts;

namespace OmicsScreen.Reporting.Screen;

/// <summary>How the report and the console name a cohort effect measure and its held-out score, one place for every outcome kind.</summary>
public static class CohortMeasureWords
{
    /// <summary>"AUC", "rho" or "HR per SD", as in table headers.</summary>
    public static string Short(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "rho",
        CohortEffectMeasure.HazardRatioPerSd => "HR per SD",
        _ => "AUC",
    };

    /// <summary>The measure in a sentence.</summary>
    public static string Long(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "Spearman's rho with the outcome",
        CohortEffectMeasure.HazardRatioPerSd => "Cox hazard ratio per SD of the marker (Efron ties)",
        _ => "AUC, positive class against the rest",
    };

    /// <summary>The value of no effect as the text shows it.</summary>
    public static string NullText(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "0",
        CohortEffectMeasure.HazardRatioPerSd => "1",
        _ => "0.5",
    };

    /// <summary>Where each cohort's interval comes from and on which scale the cohorts are pooled.</summary>
    public static string IntervalSource(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "Fisher-z interval with the Bonett & Wright (2000) variance; pooled on Fisher's z scale",
        CohortEffectMeasure.HazardRatioPerSd => "Wald interval of the cohort's Cox model, the marker in units of its SD over all samples; pooled on the log scale",
        _ => "DeLong interval",
    };

    /// <summary>The minimum spread of the heterogeneity flag in words.</summary>
    public static string SpreadText(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "the cohorts' rho values lie at least 0.30 apart",
        CohortEffectMeasure.HazardRatioPerSd => "the largest cohort hazard ratio is at least 1.42 times the smallest (0.35 on the log scale)",
        _ => "the cohorts' AUCs lie at least 0.10 apart",
    };

    /// <summary>The held-out score's name: "AUC", "R²" or "C".</summary>
    public static string HeldOutScore(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "R²",
        CohortEffectMeasure.HazardRatioPerSd => "C",
        _ => "AUC",
    };

    /// <summary>The association measure between outcome and cohort.</summary>
    public static string AssociationName(CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => "eta of the outcome's ranks on cohort",
        CohortEffectMeasure.HazardRatioPerSd => "eta of the follow-up's martingale residuals on cohort",
        _ => "Cramér's V",
    };
}
