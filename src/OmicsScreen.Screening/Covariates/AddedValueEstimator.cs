using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Covariates;

/// <summary>
/// The panel's added value over clinical covariates, in the same outer folds as the panel-size
/// curve (so the panel is chosen inside each fold by the inner screen and never sees its test
/// samples). In every fold a forest on the covariates alone and one on the covariates beside the
/// fold's locked panel are grown on the training rows and asked about the test rows; the panel
/// alone is the curve's own locked-panel score of that fold.
/// </summary>
/// <remarks>
/// Pooling: each sample is a test sample once per fold repeat, so its predictions are averaged
/// over the repeats and every sample enters the pooled score once (pooling the repeats' copies
/// would count each sample several times and shrink the interval). Two classes: pooled AUC
/// and the paired comparison of DeLong, DeLong &amp; Clarke-Pearson (1988, Biometrics 44(3)) of the
/// covariates-and-panel scores against the covariates' scores. More than two classes (accuracy, as
/// the curve scores them: each sample's hits averaged over the repeats, then their mean), measured
/// outcomes (R², 1 - SSE/SST) and follow-up (Harrell's C) have no such closed form here: their interval is the percentile
/// interval of a paired bootstrap over samples (the same resampled samples score both models),
/// 2,000 resamples from a fixed stream, and the p-value is twice the smaller share of
/// bootstrap gains on either side of 0 (Efron &amp; Tibshirani 1993, An Introduction to the
/// Bootstrap, ch. 13 and 16; from memory). The predictions come from the held-out folds, so the
/// bootstrap treats them as fixed and does not redo the folds: it measures the sampling error of
/// the samples scored, not that of refitting.
/// </remarks>
internal static class AddedValueEstimator
{
    /// <summary>
    /// Smallest leaf of the covariates' forest: the probability forest's usual size (Malley et al.
    /// 2012, Methods Inf Med 51(1); ranger's default for probability forests, from memory).
    /// </summary>
    private const int ProbabilityLeafSize = 10;

    private const int BootstrapResamples = 2000;
    private const double Level = 0.95;

    /// <summary>Null when the panel has no covariates or the curve has no folds.</summary>
    public static AddedValue? Estimate(ScreenContext context, IReadOnlyList<OuterFold> folds, PanelSizeCurve curve)
    {
        var panel = context.Panel;
        if (panel.Covariates.Count == 0 || curve.FoldPanels.Count != folds.Count || folds.Count == 0) return null;
        // More than two classes: the curve scores accuracy, so the samples' hits are pooled instead of a positive class's probability.
        bool severalClasses = panel.Kind == OutcomeKind.Classes && panel.Outcome.ClassCount > 2;

        var covariates = new BinMapper().Bin(CovariateMatrix(panel), context.ThreadCount);
        var covariateColumns = Enumerable.Range(0, covariates.FeatureCount).ToArray();
        int sampleCount = panel.SampleCount;
        var sums = new double[3, sampleCount];
        var counts = new int[sampleCount];
        int withoutPanel = 0;
        double sizeSum = 0;
        for (int i = 0; i < folds.Count; i++)
        {
            context.Cancellation.ThrowIfCancellationRequested();
            var fold = folds[i];
            var foldPanel = curve.FoldPanels[i];
            var streams = RandomStreams.CovariateScoring(RandomStreams.CurveFoldScreenSeed(context.Options.Seed, fold.Repeat, fold.Fold));
            var alone = Score(context, covariates, covariateColumns, fold, streams, covariatesOnly: true);
            PanelScore both;
            if (foldPanel.Features.Length == 0)
            {
                withoutPanel++;
                both = alone;
            }
            else
            {
                sizeSum += foldPanel.Features.Length;
                var beside = context.Matrix.SelectFeatures(foldPanel.Features).Beside(covariates);
                both = Score(context, beside, Enumerable.Range(0, beside.FeatureCount).ToArray(), fold, streams, covariatesOnly: false);
            }
            for (int t = 0; t < fold.TestRows.Length; t++)
            {
                int row = fold.TestRows[t];
                sums[0, row] += severalClasses ? alone.Hits[t] : alone.Predictions[t];
                sums[1, row] += severalClasses ? foldPanel.Locked.Hits[t] : foldPanel.Locked.Predictions[t];
                sums[2, row] += severalClasses ? both.Hits[t] : both.Predictions[t];
                counts[row]++;
            }
        }

        var scored = new List<int>(sampleCount);
        for (int s = 0; s < sampleCount; s++) if (counts[s] > 0) scored.Add(s);
        var predictions = new double[3][];
        for (int m = 0; m < 3; m++)
        {
            predictions[m] = new double[scored.Count];
            for (int k = 0; k < scored.Count; k++) predictions[m][k] = sums[m, scored[k]] / counts[scored[k]];
        }
        var pooled = new PooledScore(panel, scored.ToArray());
        double covariateScore = pooled.Of(predictions[0]), panelScore = pooled.Of(predictions[1]), bothScore = pooled.Of(predictions[2]);
        ConfidenceInterval interval;
        double p;
        string method;
        if (panel.Kind == OutcomeKind.Classes && !severalClasses)
        {
            var comparison = DeLong.ComparePaired(predictions[2], predictions[0], pooled.IsPositive, Level);
            (interval, p, method) = (comparison.Interval, comparison.PValue, "delong");
        }
        else
        {
            (interval, p) = PairedBootstrap(pooled, predictions[2], predictions[0], RandomStreams.AddedValueBootstrap(context.Options.Seed));
            method = "bootstrap";
        }
        var names = panel.Covariates.Select(c => c.Name).ToArray();
        return new AddedValue(context.ScreenOutcome.ScoreName, names, covariateScore, panelScore, bothScore, bothScore - covariateScore, interval, p, method,
            scored.Count, context.Options.CurveFolds, context.Options.CurveFoldRepeats, withoutPanel, sizeSum / folds.Count);
    }

    /// <summary>The covariates as a matrix of one column each: numbers, or a categorical column's level codes (see <see cref="Covariate"/>).</summary>
    internal static FeatureMatrix CovariateMatrix(Panel panel)
    {
        var builder = new FeatureMatrixBuilder(panel.Covariates.Select(c => c.Name).ToArray(), panel.Matrix.SampleIds);
        for (int c = 0; c < panel.Covariates.Count; c++)
        {
            var values = panel.Covariates[c].Values;
            for (int s = 0; s < values.Length; s++) builder.SetMeasured(c, s, (float)values[s]);
        }
        return builder.Build();
    }

    /// <summary>
    /// A forest on some columns of <paramref name="matrix"/> scored on the fold's test rows. With
    /// <paramref name="covariatesOnly"/>, every column is tried at every split (bagged trees) and
    /// leaves hold at least <see cref="ProbabilityLeafSize"/> samples: with a handful of columns a
    /// random subset of floor(sqrt(k)) forces a split on whatever was drawn, for two covariates a
    /// covariate without signal half of the time, and fully grown trees on one strong covariate
    /// give a jagged step function of it; both weaken the covariates' forest and would credit the
    /// panel with the difference (seen on the tests' age-proxy simulation: +0.05 AUC with the
    /// curve's settings, markers carrying nothing but age). A forest holding panel markers is the
    /// curve's own panel forest (floor(sqrt(k)) columns per split, the screen's smallest leaf), so
    /// the panel alone and the panel beside the covariates are scored alike.
    /// </summary>
    private static PanelScore Score(ScreenContext context, BinnedMatrix matrix, int[] features, OuterFold fold, ForestStreams streams,
        bool covariatesOnly)
    {
        var options = context.Settings.ForestOptions(context.Subject, streams);
        options = options with
        {
            Tree = covariatesOnly
                ? options.Tree with { FeaturesPerSplit = features.Length, MinLeafSize = Math.Max(options.Tree.MinLeafSize, ProbabilityLeafSize) }
                : options.Tree with { FeaturesPerSplit = null },
        };
        return context.ScreenOutcome.ScorePanel(matrix, features, fold.TrainingRows, fold.TestRows, options);
    }

    /// <summary>
    /// Percentile interval and two-sided p of score(a) - score(b) over paired bootstrap resamples
    /// of the scored samples; resamples where either score is undefined are skipped.
    /// </summary>
    private static (ConfidenceInterval Interval, double PValue) PairedBootstrap(PooledScore pooled, double[] a, double[] b,
        Xoshiro256StarStar generator)
    {
        int n = a.Length;
        var picks = new int[n];
        var gains = new List<double>(BootstrapResamples);
        for (int r = 0; r < BootstrapResamples; r++)
        {
            for (int k = 0; k < n; k++) picks[k] = generator.NextInt(n);
            double gain = pooled.Of(a, picks) - pooled.Of(b, picks);
            if (double.IsFinite(gain)) gains.Add(gain);
        }
        if (gains.Count < BootstrapResamples / 2) return (ConfidenceInterval.Undefined(Level), double.NaN);
        var sorted = gains.ToArray();
        Array.Sort(sorted);
        double tail = (1 - Level) / 2;
        double lower = Quantile.OfSorted(sorted, tail, QuantileDefinition.Linear), upper = Quantile.OfSorted(sorted, 1 - tail, QuantileDefinition.Linear);
        int below = 0, above = 0;
        foreach (double gain in sorted)
        {
            if (gain <= 0) below++;
            if (gain >= 0) above++;
        }
        double p = Math.Min(1, 2.0 * Math.Min(below, above) / sorted.Length);
        return (new ConfidenceInterval(lower, upper, Level), p);
    }
}
