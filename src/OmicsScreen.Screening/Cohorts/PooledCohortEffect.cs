using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>One cohort's effect of a marker on a measured or time-to-event outcome.</summary>
/// <param name="Effect">Spearman's rho (measured outcome) or the log hazard ratio per panel-wide SD (time to event).</param>
/// <param name="PooledScale">The value pooled: Fisher's z = atanh(rho), or the log hazard ratio itself.</param>
/// <param name="Variance">The variance of <see cref="PooledScale"/>: (1 + rho^2/2)/(n - 3) (Bonett &amp; Wright 2000) or the Cox model's squared standard error.</param>
public sealed record CohortOutcomeEffect(string Cohort, int Samples, double Effect, double PooledScale, double Variance);

/// <summary>A marker's per-cohort effects and their random-effects pooling.</summary>
/// <param name="Pooled">DerSimonian-Laird pooling on the pooled scale (Cochran's Q, tau^2, I^2 with it).</param>
/// <param name="PooledEffect">The random-effects estimate back on the effect's scale (tanh for rho), with its interval.</param>
/// <param name="Skipped">Cohorts too small to give an effect: fewer than 4 complete pairs, or fewer than 2 events.</param>
public sealed record PooledCohortEffect(
    IReadOnlyList<CohortOutcomeEffect> Cohorts, MetaAnalysisResult? Pooled, double PooledEffect, ConfidenceInterval PooledInterval,
    IReadOnlyList<string> Skipped);

/// <summary>
/// Per-cohort effects of one marker on a measured or time-to-event outcome, pooled across cohorts
/// by a random-effects model (DerSimonian &amp; Laird 1986), for the cohort check of these outcome kinds.
/// </summary>
/// <remarks>
/// Spearman's rho is pooled on Fisher's z scale with the variance Bonett &amp; Wright (2000) give for
/// Spearman's rho, and the pooled z turned back by tanh. The log hazard ratio of each cohort's Cox
/// model (Efron ties) is taken per SD of the marker over the whole panel, so that every cohort
/// speaks in the same unit. Values are prepared as in the per-marker tables (below-detection cells
/// tied lowest for ranks, at limit/sqrt(2) for the Cox model; missing cells left out).
/// </remarks>
public static class CohortOutcomePooling
{
    public static PooledCohortEffect Spearman(FeatureMatrix matrix, int feature, ReadOnlySpan<double> outcome, SampleGrouping cohort,
        double level = 0.95)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(cohort);
        var x = new double[matrix.SampleCount];
        MarkerValues.RankScale(matrix, feature, x);
        var y = outcome.ToArray();
        var effects = new List<CohortOutcomeEffect>();
        var skipped = new List<string>();
        foreach (var (name, members) in Members(cohort))
        {
            var result = SpearmanTest.Test(members.Select(s => x[s]).ToArray(), members.Select(s => y[s]).ToArray(), level);
            if (result.Pairs < 4 || double.IsNaN(result.Rho) || Math.Abs(result.Rho) >= 1) { skipped.Add(name); continue; }
            effects.Add(new CohortOutcomeEffect(name, result.Pairs, result.Rho, Math.Atanh(result.Rho),
                (1 + result.Rho * result.Rho / 2) / (result.Pairs - 3)));
        }
        return Pool(effects, skipped, level, Math.Tanh);
    }

    public static PooledCohortEffect LogHazardRatio(FeatureMatrix matrix, int feature, ReadOnlySpan<double> time,
        ReadOnlySpan<bool> eventObserved, SampleGrouping cohort, double level = 0.95)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        ArgumentNullException.ThrowIfNull(cohort);
        var x = new double[matrix.SampleCount];
        MarkerValues.ModelScale(matrix, feature, x);
        var measured = x.Where(v => !double.IsNaN(v)).ToArray();
        // Fewer than two measured values give no SD: every cohort is then skipped below.
        double mean = measured.Length > 0 ? measured.Average() : double.NaN;
        double sd = measured.Length > 1 ? Math.Sqrt(measured.Sum(v => (v - mean) * (v - mean)) / (measured.Length - 1)) : double.NaN;
        var t = time.ToArray();
        var e = eventObserved.ToArray();
        var effects = new List<CohortOutcomeEffect>();
        var skipped = new List<string>();
        foreach (var (name, members) in Members(cohort))
        {
            var kept = members.Where(s => !double.IsNaN(x[s])).ToArray();
            if (kept.Count(s => e[s]) < 2 || !(sd > 0)) { skipped.Add(name); continue; }
            var fit = CoxSingleMarker.Fit(kept.Select(s => t[s]).ToArray(), kept.Select(s => e[s]).ToArray(),
                kept.Select(s => x[s]).ToArray(), level);
            if (!fit.Converged || !(fit.StandardError > 0)) { skipped.Add(name); continue; }
            double logHr = fit.Coefficient * sd, se = fit.StandardError * sd;
            effects.Add(new CohortOutcomeEffect(name, kept.Length, logHr, logHr, se * se));
        }
        return Pool(effects, skipped, level, v => v);
    }

    private static PooledCohortEffect Pool(List<CohortOutcomeEffect> effects, List<string> skipped, double level, Func<double, double> back)
    {
        if (effects.Count < 2)
            return new PooledCohortEffect(effects, null, double.NaN, ConfidenceInterval.Undefined(level), skipped);
        var meta = RandomEffectsMetaAnalysis.DerSimonianLaird(effects.Select(c => c.PooledScale).ToArray(),
            effects.Select(c => c.Variance).ToArray(), level);
        var interval = new ConfidenceInterval(back(meta.RandomInterval.Lower), back(meta.RandomInterval.Upper), level);
        return new PooledCohortEffect(effects, meta, back(meta.RandomEstimate), interval, skipped);
    }

    private static IEnumerable<(string Name, int[] Members)> Members(SampleGrouping cohort)
    {
        var levels = cohort.SampleLevels.ToArray();
        for (int level = 0; level < cohort.LevelCount; level++)
        {
            var members = Enumerable.Range(0, levels.Length).Where(s => levels[s] == level).ToArray();
            if (members.Length > 0) yield return (cohort.LevelNames[level], members);
        }
    }
}
