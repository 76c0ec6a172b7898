using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Metrics;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Resampling;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Work;

namespace OmicsScreen.Screening.Screen;

/// <summary>
/// How well a panel of each size classifies, estimated without selection bias: in every outer
/// fold the whole screen runs on the training part only, a forest on its top-k features is
/// scored on the untouched test part (Ambroise &amp; McLachlan 2002, PNAS 99(10)). Beside it, the
/// optimistic estimate that picks features once on all samples and scores the same folds, so a
/// user sees how much selection on the same samples flatters a panel.
/// </summary>
internal static class PanelSizeEstimator
{
    /// <summary>Index slot offset of the outer folds' inner-screen seeds (kept clear of the main screen's streams).</summary>
    private const int InnerSeedSlot = 1000;

    /// <summary>1, 2, 3, 5, 8, 13, 21, ... (Fibonacci steps) up to the limit, always ending at the limit.</summary>
    public static int[] SizeGrid(int limit)
    {
        var sizes = new List<int>();
        int a = 1, b = 2;
        while (a <= limit)
        {
            sizes.Add(a);
            (a, b) = (b, a + b);
        }
        if (sizes[^1] != limit) sizes.Add(limit);
        return sizes.ToArray();
    }

    /// <summary>Seed of the inner screen (and the scoring forests) of an outer fold.</summary>
    internal static ulong InnerSeed(ScreenOptions options, OuterFold fold) =>
        SeedSchedule.Derive(options.Seed, fold.Repeat, InnerSeedSlot + fold.Fold, SeedPurpose.Resampling);

    public static PanelSizeCurve Estimate(BinnedMatrix matrix, Panel panel, ScreenSettings settings, int[] fullOrder,
        ScreenWork work, Action<int, int>? foldDone, CancellationToken cancellation)
    {
        var options = settings.Options;
        var outcome = panel.Outcome;
        bool binary = outcome.ClassCount == 2;
        var folds = work.CurveFolds;
        var sizes = SizeGrid(Math.Min(options.CurveMaxPanelSize, matrix.FeatureCount));
        var selectionAware = new double[folds.Count, sizes.Length];
        var selectionAwareError = new double[folds.Count, sizes.Length];
        var optimistic = new double[folds.Count, sizes.Length];
        var optimisticError = new double[folds.Count, sizes.Length];
        for (int i = 0; i < folds.Count; i++)
        {
            cancellation.ThrowIfCancellationRequested();
            var fold = folds[i];
            ulong innerSeed = InnerSeed(options, fold);
            var innerOrder = work.CurveFoldScreen(i, cancellation).Order;
            for (int s = 0; s < sizes.Length; s++)
            {
                (selectionAware[i, s], selectionAwareError[i, s]) = Score(matrix, panel, settings, innerOrder.AsSpan(0, sizes[s]), fold, innerSeed, s, binary);
                (optimistic[i, s], optimisticError[i, s]) = Score(matrix, panel, settings, fullOrder.AsSpan(0, sizes[s]), fold, innerSeed, s, binary);
            }
            foldDone?.Invoke(i + 1, folds.Count);
        }

        var points = new PanelSizePoint[sizes.Length];
        var means = new double[sizes.Length];
        var errors = new double[sizes.Length];
        for (int s = 0; s < sizes.Length; s++)
        {
            var (hMean, hSd) = MeanAndSd(selectionAware, s);
            var (oMean, oSd) = MeanAndSd(optimistic, s);
            double se = hSd / Math.Sqrt(folds.Count);
            points[s] = new PanelSizePoint(sizes[s], hMean, hSd, se, MeanAndSd(selectionAwareError, s).Mean, oMean, oSd,
                MeanAndSd(optimisticError, s).Mean, folds.Count);
            means[s] = hMean;
            errors[s] = se;
        }
        int chosen = OneStandardErrorRule.Choose(sizes, means, errors, ScoreDirection.HigherIsBetter);
        return new PanelSizeCurve(binary ? "auc" : "accuracy", points, chosen >= 0 ? sizes[chosen] : sizes[^1],
            options.CurveFolds, options.CurveFoldRepeats);
    }

    /// <summary>Grows a forest on the fold's training rows using the given features and scores the test rows.</summary>
    private static (double Score, double Error) Score(BinnedMatrix matrix, Panel panel, ScreenSettings settings,
        ReadOnlySpan<int> features, OuterFold fold, ulong seed, int sizeIndex, bool binary)
    {
        var outcome = panel.Outcome;
        var selected = matrix.SelectFeatures(features);
        // The panel forest tries floor(sqrt(k)) features per split of its own k, whatever the screen used.
        var forestOptions = settings.ForestOptions(panel.Subject, seed, sizeIndex);
        forestOptions = forestOptions with { Tree = forestOptions.Tree with { FeaturesPerSplit = null } };
        var forest = ForestTrainer.Train(selected, outcome, forestOptions, fold.TrainingRows);
        var prediction = forest.Predict(selected);
        var classes = outcome.SampleClasses;
        int wrong = 0;
        var scores = new double[fold.TestRows.Length];
        var positive = new bool[fold.TestRows.Length];
        for (int i = 0; i < fold.TestRows.Length; i++)
        {
            int row = fold.TestRows[i];
            if (prediction.PredictedClasses[row] != classes[row]) wrong++;
            scores[i] = prediction.Probability(row, outcome.PositiveClass);
            positive[i] = classes[row] == outcome.PositiveClass;
        }
        double error = (double)wrong / fold.TestRows.Length;
        double score = binary ? MannWhitneyAuc.Compute(scores, positive) : 1 - error;
        return (score, error);
    }

    private static (double Mean, double Sd) MeanAndSd(double[,] values, int column)
    {
        int count = values.GetLength(0);
        double sum = 0;
        for (int i = 0; i < count; i++) sum += values[i, column];
        double mean = sum / count;
        if (count < 2) return (mean, double.NaN);
        double squares = 0;
        for (int i = 0; i < count; i++) squares += (values[i, column] - mean) * (values[i, column] - mean);
        return (mean, Math.Sqrt(squares / (count - 1)));
    }
}
