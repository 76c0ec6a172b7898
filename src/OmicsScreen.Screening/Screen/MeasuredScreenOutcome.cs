using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Parallelism;
using OmicsScreen.Engine.Regression;
using OmicsScreen.Screening.Effects;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// A measured quantity: regression forests (variance-decrease splits, Breiman et al. 1984), the
/// out-of-bag rise in squared error as permutation importance, Spearman's test beside the forest,
/// and held-out panels scored by R².
/// </summary>
internal sealed class MeasuredScreenOutcome(MeasuredOutcome outcome) : ScreenOutcome
{
    private readonly double[] _values = outcome.Values.ToArray();

    public override OutcomeKind Kind => OutcomeKind.Measured;

    /// <summary>
    /// A fold's panel is as long as the locked one, not capped at the fold's own list: the fit of
    /// many additive markers grows with their number (R² here, C for follow-up), and the inner
    /// screen, on 80% of the samples with 5 half-sample pairs, lists far fewer of them than the
    /// full screen (calibration: 2-5 against about 11 on the measured planted design), so capped
    /// folds estimated a shorter panel than the one locked (R² 0.17 against 0.27 on fresh samples).
    /// </summary>
    public override bool FoldPanelsTakeLockedLength => true;

    public override string ScoreName => "r_squared";

    public override ResamplingStrata Strata { get; } = ResamplingStrata.Of(outcome);

    public override void GrowRepeat(BinnedMatrix matrix, int[] rows, ForestOptions options, ReadOnlySpan<int> decoySources,
        int threadCount, Span<double> impurity, Span<double> permutation, Span<double> corrected, Span<double> decoys)
    {
        var forest = RegressionForestTrainer.Train(matrix, _values, options, rows);
        forest.MeanImpurityDecrease().CopyTo(impurity);
        RegressionImportance.MeasurePermutation(forest, matrix, _values, threadCount).MeanRise.CopyTo(permutation);
        var air = RegressionImportance.MeasureCorrected(matrix, _values, rows, decoySources, options);
        air.Features.CopyTo(corrected);
        air.Decoys.CopyTo(decoys);
    }

    public override ReferenceForest GrowReference(BinnedMatrix matrix, ForestOptions options)
    {
        var forest = RegressionForestTrainer.Train(matrix, _values, options);
        var outOfBag = new RegressionOutOfBag(forest, _values);
        var summary = new ReferenceForestSummary(outOfBag.MeanSquaredError, [], null, outOfBag.ErrorCurve.ToArray())
        {
            OutOfBagRSquared = outOfBag.RSquared,
            OutOfBagPredictions = outOfBag.Predictions.ToArray(),
        };
        return new ReferenceForest(summary, null) { LeafValues = TreeLeafValues.OfRegressionForest(forest) };
    }

    public override IReadOnlyList<TreeLeafValues> GrowLeafValues(BinnedMatrix matrix, ForestOptions options) =>
        TreeLeafValues.OfRegressionForest(RegressionForestTrainer.Train(matrix, _values, options));

    /// <summary>Tenths of the outcome by rank (ties by sample order), so a copy keeps its marker's trend with the outcome.</summary>
    public override int[] PartnerStrata() => Effects.PartnerStrata.RankBins(_values, PartnerStratumCount);

    /// <summary>Strata of the partner scan's copies.</summary>
    public const int PartnerStratumCount = 10;

    public override SingleMarkerStatistics SingleMarkers(Panel panel, int threadCount)
    {
        var markers = MeasuredOutcomeScreen.Compute(panel.Matrix, _values, threadCount: threadCount);
        return new SingleMarkerStatistics(new UnivariateTable([], [], []), markers, [],
            Ranking.OrdinalRanks(markers.Select(m => m.PValue).ToArray(), ScoreDirection.LowerIsBetter), -1);
    }

    /// <summary>Spearman's rho with its t-approximation p-value (<see cref="SpearmanTest"/>), per column.</summary>
    public override double[] RankTestPValues(FeatureMatrix values, int[] rows, int threadCount)
    {
        var y = AtRows(_values, rows);
        var pValues = new double[values.FeatureCount];
        Parallel.For(0, values.FeatureCount, WorkerThreads.Options(threadCount),
            () => (All: new double[values.SampleCount], Rows: new double[rows.Length]),
            (feature, _, buffers) =>
            {
                MarkerValues.RankScale(values, feature, buffers.All);
                for (int i = 0; i < rows.Length; i++) buffers.Rows[i] = buffers.All[rows[i]];
                double p = SpearmanTest.Test(buffers.Rows, y).PValue;
                pValues[feature] = double.IsNaN(p) ? 1 : p;
                return buffers;
            }, _ => { });
        return pValues;
    }

    public override PanelScore ScorePanel(BinnedMatrix matrix, ReadOnlySpan<int> features, int[] trainingRows, ReadOnlySpan<int> testRows,
        ForestOptions options)
    {
        var selected = matrix.SelectFeatures(features);
        var forest = RegressionForestTrainer.Train(selected, _values, options, trainingRows);
        return Scored(AtRows(forest.Predict(selected), testRows), testRows);
    }

    /// <summary>Every test sample predicted at the training part's mean: what a panel must beat.</summary>
    public override PanelScore ChanceScore(int[] trainingRows, int[] testRows)
    {
        double mean = 0;
        foreach (int row in trainingRows) mean += _values[row];
        mean /= trainingRows.Length;
        var predictions = new double[testRows.Length];
        Array.Fill(predictions, mean);
        return Scored(predictions, testRows);
    }

    /// <summary>
    /// Held-out R² = 1 - SSE / SST with SST about the test samples' own mean (the coefficient of
    /// determination as scikit-learn's r2_score computes it): 0 for a panel no better than the test
    /// mean, negative for one worse than it. NaN when the test outcome does not vary.
    /// </summary>
    private PanelScore Scored(double[] predictions, ReadOnlySpan<int> testRows)
    {
        var observed = new double[testRows.Length];
        for (int i = 0; i < testRows.Length; i++) observed[i] = _values[testRows[i]];
        var fit = SquaredErrorFit.Of(observed, predictions);
        return new PanelScore(fit.RSquared, fit.MeanSquaredError, predictions, [])
        {
            RootMeanSquaredError = fit.RootMeanSquaredError,
        };
    }
}
