using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Metrics;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Randomness;
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

    /// <summary>Seed of the inner screen of an outer fold.</summary>
    internal static ulong InnerSeed(ScreenOptions options, OuterFold fold) =>
        RandomStreams.CurveFoldScreenSeed(options.Seed, fold.Repeat, fold.Fold);

    /// <summary>The sizes on the curve: the Fibonacci grid up to the limit, and the shortlist's length if it is within it.</summary>
    public static int[] SizesFor(int limit, int shortlistLength)
    {
        var sizes = new SortedSet<int>(SizeGrid(limit));
        if (shortlistLength >= 1 && shortlistLength <= limit) sizes.Add(shortlistLength);
        return sizes.ToArray();
    }

    /// <summary>
    /// The lock rule: the one-standard-error choice among sizes no longer than the list; 0 for an
    /// empty list. Points with NaN means are skipped.
    /// </summary>
    public static int LockedSize(ReadOnlySpan<int> sizes, ReadOnlySpan<double> means, ReadOnlySpan<double> standardErrors, int listLength)
    {
        if (listLength < 1) return 0;
        int allowed = 0;
        while (allowed < sizes.Length && sizes[allowed] <= listLength) allowed++;
        if (allowed == 0) return Math.Min(listLength, sizes.Length > 0 ? sizes[0] : listLength);
        int chosen = OneStandardErrorRule.Choose(sizes[..allowed], means[..allowed], standardErrors[..allowed], ScoreDirection.HigherIsBetter);
        return chosen >= 0 ? sizes[chosen] : Math.Min(listLength, sizes[allowed - 1]);
    }

    /// <summary>The curve over the outer folds of <paramref name="work"/>; progress is reported per fold.</summary>
    public static PanelSizeCurve Estimate(ScreenContext context, int[] fullOrder, int shortlistLength, ScreenWork work)
    {
        var (matrix, options) = (context.Matrix, context.Options);
        var model = context.ScreenOutcome;
        // Only a two-class outcome has the pooled out-of-fold ROC curve.
        bool binary = model.ScoreName == "auc";
        var folds = work.CurveFolds;
        int limit = Math.Min(options.CurveMaxPanelSize, matrix.FeatureCount);
        var sizes = SizesFor(limit, shortlistLength);
        var selectionAware = new double[folds.Count, sizes.Length];
        var selectionAwareScores = new PanelScore[folds.Count, sizes.Length];
        var optimisticScores = new PanelScore[folds.Count, sizes.Length];
        var innerScreens = new InnerScreenResult[folds.Count];
        for (int i = 0; i < folds.Count; i++)
        {
            context.Cancellation.ThrowIfCancellationRequested();
            var fold = folds[i];
            ulong innerSeed = InnerSeed(options, fold);
            innerScreens[i] = work.CurveFoldScreen(i);
            var innerOrder = innerScreens[i].Order;
            for (int s = 0; s < sizes.Length; s++)
            {
                var aware = Score(context, innerOrder.AsSpan(0, sizes[s]), fold, RandomStreams.PanelScoring(innerSeed, s));
                var flattered = Score(context, fullOrder.AsSpan(0, sizes[s]), fold, RandomStreams.PanelScoring(innerSeed, s));
                selectionAwareScores[i, s] = aware;
                optimisticScores[i, s] = flattered;
                selectionAware[i, s] = aware.Score;
            }
            context.Report(ScreenStage.PanelSizeCurve, i + 1, folds.Count);
        }

        var points = new PanelSizePoint[sizes.Length];
        var means = new double[sizes.Length];
        var errors = new double[sizes.Length];
        var awareColumn = new PanelScore[folds.Count];
        var optimisticColumn = new PanelScore[folds.Count];
        for (int s = 0; s < sizes.Length; s++)
        {
            for (int i = 0; i < folds.Count; i++) (awareColumn[i], optimisticColumn[i]) = (selectionAwareScores[i, s], optimisticScores[i, s]);
            points[s] = Summarise(sizes[s], awareColumn, optimisticColumn);
            means[s] = points[s].SelectionAwareAuc;
            errors[s] = points[s].SelectionAwareAucStandardError;
        }
        int chosen = OneStandardErrorRule.Choose(sizes, means, errors, ScoreDirection.HigherIsBetter);
        int lockedSize = LockedSize(sizes, means, errors, Math.Min(shortlistLength, limit));

        // The estimate of the locked panel repeats the lock rule inside every fold: the inner
        // screen's shortlist, cut at the size the same rule picks from the OTHER folds' scores, so
        // no fold's held-out part takes part in choosing the size it is scored at. Where the
        // outcome kind says so, the size may reach the full list's length, the inner list then
        // continued down the inner order (ScreenOutcome.FoldPanelsTakeLockedLength).
        var lockedScores = new double[folds.Count];
        // Every fold's held-out probabilities of the positive class under the locked procedure,
        // pooled: the cross-validated ROC curve of the locked panel (two classes only).
        var outOfFoldScores = new List<double>();
        var outOfFoldPositive = new List<bool>();
        var foldPanels = new FoldPanel[folds.Count];
        int withoutPanel = 0;
        double sizeSum = 0;
        for (int i = 0; i < folds.Count; i++)
        {
            var fold = folds[i];
            var inner = innerScreens[i];
            bool lockedLength = model.FoldPanelsTakeLockedLength;
            int listLength = Math.Min(lockedLength ? shortlistLength : inner.Shortlist.Length, limit);
            if (listLength == 0)
            {
                withoutPanel++;
                // A fold that locks nothing calls every held-out sample alike.
                var chance = model.ChanceScore(fold.TrainingRows, fold.TestRows);
                lockedScores[i] = chance.Score;
                AddOutOfFold(chance, outOfFoldScores, outOfFoldPositive);
                foldPanels[i] = new FoldPanel([], chance);
                continue;
            }
            var otherMeans = new double[sizes.Length];
            var otherErrors = new double[sizes.Length];
            for (int s = 0; s < sizes.Length; s++)
            {
                var (mean, sd) = SampleMoments.OfColumn(selectionAware, s, skippedRow: i);
                otherMeans[s] = mean;
                otherErrors[s] = sd / Math.Sqrt(Math.Max(1, folds.Count - 1));
            }
            int size = LockedSize(sizes, otherMeans, otherErrors, listLength);
            sizeSum += size;
            var panelFeatures = lockedLength ? ListThenOrder(inner, size).AsSpan() : inner.Shortlist.AsSpan(0, size);
            int onGrid = Array.IndexOf(sizes, size);
            PanelScore locked;
            if (onGrid >= 0 && panelFeatures.SequenceEqual(inner.Order.AsSpan(0, size)))
                locked = selectionAwareScores[i, onGrid];
            else
                locked = Score(context, panelFeatures, fold, RandomStreams.PanelScoring(InnerSeed(options, fold), sizes.Length));
            lockedScores[i] = locked.Score;
            AddOutOfFold(locked, outOfFoldScores, outOfFoldPositive);
            foldPanels[i] = new FoldPanel(panelFeatures.ToArray(), locked);
        }
        var (lockedMean, lockedSd) = SampleMoments.Of(lockedScores);
        return new PanelSizeCurve(model.ScoreName, points, chosen >= 0 ? sizes[chosen] : sizes[^1],
            options.CurveFolds, options.CurveFoldRepeats)
        {
            LockedSize = lockedSize,
            LockedEstimate = lockedMean,
            LockedEstimateStandardError = lockedSd / Math.Sqrt(lockedScores.Length),
            FoldsWithoutPanel = withoutPanel,
            MeanFoldPanelSize = sizeSum / folds.Count,
            LockedOutOfFoldScores = binary ? outOfFoldScores.ToArray() : [],
            LockedOutOfFoldPositive = binary ? outOfFoldPositive.ToArray() : [],
            FoldPanels = foldPanels,
        };
    }

    /// <summary>
    /// One size's point from its outer folds' held-out scores, in fold order: the mean and SD over
    /// folds of the score, its standard error SD / sqrt(folds), and the means of the error and of
    /// the root mean squared error (NaN for the kinds that have none).
    /// </summary>
    internal static PanelSizePoint Summarise(int panelSize, ReadOnlySpan<PanelScore> selectionAware, ReadOnlySpan<PanelScore> optimistic)
    {
        int foldCount = selectionAware.Length;
        if (optimistic.Length != foldCount) throw new ArgumentException("Both estimates need one score per fold.");
        var (awareScore, awareError, awareRmse) = (new double[foldCount], new double[foldCount], new double[foldCount]);
        var (optimisticScore, optimisticError, optimisticRmse) = (new double[foldCount], new double[foldCount], new double[foldCount]);
        for (int i = 0; i < foldCount; i++)
        {
            (awareScore[i], awareError[i], awareRmse[i]) = (selectionAware[i].Score, selectionAware[i].Error, selectionAware[i].RootMeanSquaredError);
            (optimisticScore[i], optimisticError[i], optimisticRmse[i]) = (optimistic[i].Score, optimistic[i].Error, optimistic[i].RootMeanSquaredError);
        }
        var (awareMean, awareSd) = SampleMoments.Of(awareScore);
        var (optimisticMean, optimisticSd) = SampleMoments.Of(optimisticScore);
        return new PanelSizePoint(panelSize, awareMean, awareSd, awareSd / Math.Sqrt(foldCount), SampleMoments.Of(awareError).Mean,
            optimisticMean, optimisticSd, SampleMoments.Of(optimisticError).Mean, foldCount)
        {
            SelectionAwareRootMeanSquaredError = SampleMoments.Of(awareRmse).Mean,
            OptimisticRootMeanSquaredError = SampleMoments.Of(optimisticRmse).Mean,
        };
    }

    /// <summary>
    /// The first <paramref name="size"/> markers of the inner screen's list, continued down its
    /// order past the list's end when the list is shorter: the fold's panel when folds take the
    /// locked panel's length (<see cref="ScreenOutcome.FoldPanelsTakeLockedLength"/>).
    /// </summary>
    internal static int[] ListThenOrder(InnerScreenResult inner, int size)
    {
        var panel = new List<int>(size);
        var listed = new HashSet<int>();
        foreach (int f in inner.Shortlist)
        {
            if (panel.Count == size) break;
            panel.Add(f);
            listed.Add(f);
        }
        foreach (int f in inner.Order)
        {
            if (panel.Count == size) break;
            if (!listed.Contains(f)) panel.Add(f);
        }
        return panel.ToArray();
    }

    /// <summary>Appends a fold's held-out probabilities of the positive class and the samples' classes (two classes only).</summary>
    private static void AddOutOfFold(PanelScore scored, List<double> scores, List<bool> positive)
    {
        if (scored.IsPositive.Length == 0) return;
        scores.AddRange(scored.Predictions);
        positive.AddRange(scored.IsPositive);
    }

    /// <summary>A panel scored on the fold's test rows (<see cref="PanelScorer"/>) in the outcome kind's score.</summary>
    private static PanelScore Score(ScreenContext context, ReadOnlySpan<int> features, OuterFold fold, ForestStreams streams) =>
        PanelScorer.Score(context, features, fold.TrainingRows, fold.TestRows, streams);
}
