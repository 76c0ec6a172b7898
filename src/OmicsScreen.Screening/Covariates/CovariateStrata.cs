using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// The strata a covariate's permutations stay within: a categorical covariate's levels, or a
/// numeric covariate cut at its quantiles into equal-count groups by rank (tied values may fall
/// on both sides of a cut, always the same way for the same input), as Strobl et al. (2008, BMC Bioinformatics 9:307) condition on a grid of the
/// conditioning variable.
/// </summary>
internal static class CovariateStrata
{
    /// <summary>At most this many strata, and at least this many samples per stratum on average.</summary>
    public const int MostStrata = 40, SamplesPerStratum = 8;

    /// <summary>How many quantile strata a numeric covariate of <paramref name="sampleCount"/> samples gets.</summary>
    public static int NumericStrata(int sampleCount) => Math.Clamp(sampleCount / SamplesPerStratum, 2, MostStrata);

    public static int[] Of(Covariate covariate, out int strataCount)
    {
        int n = covariate.SampleCount;
        var strata = new int[n];
        if (covariate.IsCategorical)
        {
            for (int s = 0; s < n; s++) strata[s] = covariate.LevelOf(s);
            strataCount = covariate.Levels.Count;
            return strata;
        }
        strataCount = NumericStrata(n);
        var order = new int[n];
        for (int s = 0; s < n; s++) order[s] = s;
        var values = covariate.Values.ToArray();
        Array.Sort(values, order);
        // Sample order[k] is the k-th smallest: it goes to stratum floor(k * strata / n).
        for (int k = 0; k < n; k++) strata[order[k]] = (int)((long)k * strataCount / n);
        return strata;
    }
}
