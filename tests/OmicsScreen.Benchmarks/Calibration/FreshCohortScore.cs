using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Engine.Survival;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// The locked panel of a measured or follow-up screen on a fresh cohort: a forest on the locked
/// markers alone, grown on every discovery sample with the screen's forest options (and, as the
/// panel-size curve's panel forests, floor(sqrt(k)) markers tried per split), asked about the
/// fresh samples. This is what the selection-aware estimate claims to estimate.
/// </summary>
/// <remarks>
/// The fresh cohort is encoded with the discovery panel's bins (<see cref="BinnedMatrix.Encode"/>),
/// as a locked panel would be applied. The forest's streams are the locked-panel forest's
/// (<see cref="RandomStreams.LockedPanelForest"/>), never those of a screen forest.
/// </remarks>
public static class FreshCohortScore
{
    /// <summary>R^2 or Harrell's C of the locked panel (the first <paramref name="lockedSize"/> of the shortlist) on the fresh cohort.</summary>
    public static double Of(Panel discovery, ScreenResult result, int lockedSize, Panel fresh, ulong seed, int threadCount)
    {
        ArgumentNullException.ThrowIfNull(discovery);
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(fresh);
        var markers = new int[lockedSize];
        for (int i = 0; i < lockedSize; i++) markers[i] = result.Shortlist[i].Forest.FeatureIndex;
        var options = result.Settings.ForestOptions(discovery.Subject, RandomStreams.LockedPanelForest(seed));
        options = options with { ThreadCount = threadCount, Tree = options.Tree with { FeaturesPerSplit = null } };
        var binned = new BinMapper().Bin(discovery.Matrix.SelectFeatures(markers), threadCount);
        var freshCodes = binned.Encode(fresh.Matrix.SelectFeatures(markers));
        return discovery.Kind switch
        {
            OutcomeKind.Measured => RSquared(fresh.Measured!.Values,
                RegressionForestTrainer.Train(binned, discovery.Measured!.Values, options).Predict(freshCodes)),
            OutcomeKind.TimeToEvent => HarrellConcordance.Estimate(fresh.FollowUp!.Times, fresh.FollowUp.Events,
                SurvivalForestTrainer.Train(binned, discovery.FollowUp!.FollowUp, options).Risk(freshCodes)).Concordance,
            _ => throw new ArgumentException("Class panels are scored by their locked panel's AUC (PanelMeasurer)."),
        };
    }

    /// <summary>
    /// 1 - SSE / SST with SST about the fresh cohort's own mean: the coefficient of determination as
    /// scikit-learn's r2_score defines it, the measure of the screen's held-out panel scores.
    /// </summary>
    public static double RSquared(ReadOnlySpan<double> observed, ReadOnlySpan<double> predicted)
    {
        if (observed.Length != predicted.Length || observed.Length == 0) throw new ArgumentException("One prediction is needed per observed value.");
        double mean = 0;
        foreach (double y in observed) mean += y;
        mean /= observed.Length;
        double residual = 0, total = 0;
        for (int i = 0; i < observed.Length; i++)
        {
            residual += (observed[i] - predicted[i]) * (observed[i] - predicted[i]);
            total += (observed[i] - mean) * (observed[i] - mean);
        }
        return total > 0 ? 1 - residual / total : double.NaN;
    }
}
