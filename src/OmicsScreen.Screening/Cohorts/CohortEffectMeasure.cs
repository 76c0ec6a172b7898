namespace OmicsScreen.Screening.Cohorts;

/// <summary>What a marker's effect within a cohort is measured in, one per outcome kind.</summary>
public enum CohortEffectMeasure
{
    /// <summary>Mann-Whitney AUC of the positive class against the rest (classes); pooled as it is, no effect at 0.5.</summary>
    Auc,

    /// <summary>Spearman's rho with a measured outcome; pooled on Fisher's z scale, no effect at 0.</summary>
    SpearmanRho,

    /// <summary>Cox hazard ratio per panel-wide SD of the marker (follow-up); pooled on the log scale, no effect at 1.</summary>
    HazardRatioPerSd,
}

/// <summary>The scale facts of each <see cref="CohortEffectMeasure"/>: where "no effect" lies, how a pooled value is read back, how far apart cohorts must be to matter.</summary>
public static class CohortEffectScale
{
    /// <summary>The value of no effect.</summary>
    public static double NullValue(this CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => 0,
        CohortEffectMeasure.HazardRatioPerSd => 1,
        _ => 0.5,
    };

    /// <summary>A value on the scale the random-effects model pools on, read back on the effect's own scale.</summary>
    public static double FromPooledScale(this CohortEffectMeasure measure, double value) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => Math.Tanh(value),
        CohortEffectMeasure.HazardRatioPerSd => Math.Exp(value),
        _ => value,
    };

    /// <summary>An effect on the scale the random-effects model pools on.</summary>
    public static double ToPooledScale(this CohortEffectMeasure measure, double effect) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => Math.Atanh(effect),
        CohortEffectMeasure.HazardRatioPerSd => Math.Log(effect),
        _ => effect,
    };

    /// <summary>
    /// The smallest spread of within-cohort effects (largest minus smallest, hazard ratios on the
    /// log scale) that a heterogeneity flag needs besides a significant Cochran's Q: with many
    /// samples a tiny difference is significant and of no consequence to a lab (common practice: a
    /// test and an effect size together). The classes' 0.10 of AUC is the reference; the others
    /// are the spreads that move the concordance index (the AUC's generalisation, Harrell et al.
    /// 1982) by the same 0.10, measured by simulation of a normal marker (4,000 samples, 5 draws;
    /// tests/OmicsScreen.TestSupport/reference/cohorts/effect_spreads.py): Spearman's rho 0.30
    /// (rho 0.295 gave C 0.599) and a log hazard ratio per SD of 0.35 (C 0.596; a hazard ratio
    /// 1.42 times another).
    /// </summary>
    public static double MinimumSpread(this CohortEffectMeasure measure) => measure switch
    {
        CohortEffectMeasure.SpearmanRho => 0.30,
        CohortEffectMeasure.HazardRatioPerSd => 0.35,
        _ => 0.10,
    };

    /// <summary>Largest minus smallest finite effect, hazard ratios compared on the log scale; NaN with none.</summary>
    public static double Spread(this CohortEffectMeasure measure, IEnumerable<CohortEffect> effects)
    {
        double low = double.PositiveInfinity, high = double.NegativeInfinity;
        foreach (var effect in effects)
        {
            if (!double.IsFinite(effect.Effect)) continue;
            double value = measure == CohortEffectMeasure.HazardRatioPerSd ? Math.Log(effect.Effect) : effect.Effect;
            low = Math.Min(low, value);
            high = Math.Max(high, value);
        }
        return high >= low ? high - low : double.NaN;
    }
}
